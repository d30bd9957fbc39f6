import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { readPdf } from '../api/read-pdf';
import { baseUrl, launchBrowser } from './browser';
import { E2E_PASSWORD } from './constants';
import { chooseAirframe, expectText, signInThroughPage as signIn } from './page-helpers';

/**
 * A pilot of the demo turboprop ZZ-KFT ticks "Icing conditions" in Chromium and reads the iced
 * VREF beside the normal one on screen and in the printed PDF. Worked by hand from the book
 * (invented demo data — not for flight): VREF is tabulated 92/97/104 kt IAS at 3,600/4,600/5,500 kg,
 * so at a landing weight of 4,600 kg it is 97 kt; the book's ice increment for "Flaps down, gear
 * down" is 10 kt, added after rounding (common practice, from memory) → 107 kt. The takeoff
 * configuration "Flaps approach" states no increment: the card says so rather than guessing.
 * `SW_SCREENSHOT_DIR`, when set, receives desktop and phone screenshots for review.
 */
const REGISTRATION = 'ZZ-KFT';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());

/** A page whose CSP lets axe-core be injected (the app's CSP forbids inline scripts). */
async function page(viewport = { width: 1024, height: 768 }): Promise<Page> {
  const context = await browser.newContext({ baseURL: baseUrl(), viewport, bypassCSP: true });
  return context.newPage();
}

const AXE_SOURCE = readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');

/** axe-core's WCAG 2.0/2.1 level A and AA rules (the tags of axe-core 4.x). */
async function axeViolations(on: Page): Promise<string[]> {
  await on.waitForFunction('document.getAnimations().length === 0');
  await on.addScriptTag({ content: AXE_SOURCE });
  const violations = await on.evaluate<{ id: string; nodes: { target: string[] }[] }[]>(
    `axe.run(document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] } }).then((r) => r.violations)`,
  );
  return violations.map((v) => `${v.id} (${v.nodes.map((n) => n.target.join(' ')).join(', ')})`);
}

async function shoot(on: Page, name: string): Promise<void> {
  const dir = process.env['SW_SCREENSHOT_DIR'];
  if (!dir) return;
  await on.screenshot({ path: join(dir, `${name}-form.png`) });
  await on.getByTestId('card-icing').screenshot({ path: join(dir, `${name}-icing.png`) });
}

describe('icing conditions in Chromium', () => {
  it.each([
    ['desktop', { width: 1024, height: 768 }],
    ['phone', { width: 390, height: 844 }],
  ] as const)('shows the iced VREF beside the normal one on screen and in the PDF (%s)', async (name, viewport) => {
    const pilot = await page(viewport);
    await signIn(pilot, 'pilot@demo.speedwright.example', E2E_PASSWORD, '/cards');
    await pilot.waitForURL('**/cards');
    await chooseAirframe(pilot, REGISTRATION);
    await pilot.getByTestId('input-landingWeight').fill('4600');
    expect(await pilot.getByTestId('card-icing').count()).toBe(0);
    await pilot.getByTestId('input-icing').locator('input').check();

    const vref = pilot.locator('[data-testid="iced-speed"][data-code="VREF"]');
    await expectText(vref, 'Iced 107');
    expect(Number(await vref.getAttribute('data-kt'))).toBe(107);
    expect(Number(await pilot.locator('[data-testid="card-speeds"] tr[data-code="VREF"] td[data-column="ias"]').innerText())).toBe(97);
    await expectText(pilot.getByTestId('icing-note'), 'No ice increment stated for Flaps approach');
    await expectText(pilot.getByTestId('card-caution'), "Planning aid. The approved flight manual and the operator's procedures govern.");
    expect(await pilot.locator('main').innerText()).not.toMatch(/NaN|undefined/);
    await shoot(pilot, `card-icing-${name}`);
    expect(await axeViolations(pilot)).toEqual([]);

    const [download] = await Promise.all([pilot.waitForEvent('download', { timeout: 60_000 }), pilot.getByTestId('print-card').click()]);
    const path = join(mkdtempSync(join(tmpdir(), 'speedwright-icing-')), download.suggestedFilename());
    await download.saveAs(path);
    if (process.env['SW_SCREENSHOT_DIR']) await download.saveAs(join(process.env['SW_SCREENSHOT_DIR'], `card-icing-${name}.pdf`));
    const { text } = await readPdf(readFileSync(path));
    const flat = text.replace(/\s+/g, ' ');
    expect(flat).toContain('ICED » 107 KIAS = VREF + 10 ice');
    expect(flat).toContain('No ice increment stated for Flaps approach');
    expect(flat).toContain('Icing conditions: ICED » figures are the normal IAS plus the book');
    expect(flat).toContain("The approved flight manual and the operator's procedures govern");
    await pilot.context().close();
  });
});
