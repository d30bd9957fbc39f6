/**
 * The card's digest is the same in Chromium as in Node: the card model (shared/card) bundled
 * for the browser, run in a page of the served app, builds the hand-worked card of
 * shared/card/testing/test-fixtures.ts and must give the digest pinned there (HAND_PISTON_CARD_DIGEST),
 * which card-digest.spec.ts checks in Node. The bundle is made with esbuild (the bundler under tsx and the Angular
 * build), for the browser platform, so nothing of Node reaches the page.
 */
import { buildSync } from 'esbuild';
import { join } from 'node:path';
import type { Browser } from 'playwright-core';
import { HAND_PISTON_CARD_DIGEST } from '@shared/card/testing/test-fixtures';
import { launchBrowser, newPage } from './browser';

const root = join(__dirname, '..', '..');

/** shared/card and its fixtures as one script that sets `window.cardModel`. */
function cardModelBundle(): string {
  const result = buildSync({
    stdin: {
      contents: [
        "export { buildCard } from './shared/card/build-card';",
        "export { cardDigest } from './shared/card/card-digest';",
        "export { HAND_CONTEXT, handPistonContent, handPistonInputs, revisionOf } from './shared/card/testing/test-fixtures';",
      ].join('\n'),
      resolveDir: root,
      loader: 'ts',
    },
    bundle: true,
    platform: 'browser',
    format: 'iife',
    globalName: 'cardModel',
    target: 'es2022',
    write: false,
  });
  return result.outputFiles[0].text;
}

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());

it('builds the hand-worked card in Chromium with the digest Node gives', async () => {
  const page = await newPage(browser);
  await page.goto('/api/health');
  const bundle = cardModelBundle();
  // Evaluated through the DevTools protocol, which the page's content security policy does not govern.
  const inPage = await page.evaluate(`(() => {
    ${bundle}
    const m = cardModel;
    const card = m.buildCard(m.revisionOf(m.handPistonContent()), m.handPistonInputs(), m.HAND_CONTEXT);
    return { digest: card.digest, recomputed: m.cardDigest(card), userAgent: navigator.userAgent, vs1: card.speeds.find((s) => s.code === 'VS1') };
  })()`);
  const { digest, recomputed, userAgent, vs1 } = inPage as { digest: string; recomputed: string; userAgent: string; vs1: { iasKt: number; casKt: number } };
  expect(userAgent).toMatch(/Chrome\//);
  expect(digest).toBe(HAND_PISTON_CARD_DIGEST);
  expect(recomputed).toBe(digest);
  // The hand-worked VS1 of build-card.spec.ts: 50·√0.9 = 47.43 KCAS → 48, 41.59 KIAS → 42.
  expect(vs1).toMatchObject({ casKt: 48, iasKt: 42 });
});
