import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, newPage } from './browser';
import { E2E_PASSWORD } from './constants';
import { expectText, signInThroughPage as signIn } from './page-helpers';

/**
 * The envelope proof through Chromium, on the seeded demo's light jet (its published revision
 * covers its declared envelope). An engineer opens a draft, cuts the highest pressure-altitude
 * column out of the VR table (a gap in a takeoff table), sees the gap as refused cells in the
 * live coverage picture, and submitting answers 422 coverage_failed with the picture and the
 * sentence. A clean draft then goes to review, where an approver sees its picture.
 *
 * Needs the server's coverage routes (`POST /api/revisions/coverage`,
 * `GET /api/revisions/:id/coverage`, submit's 422 `coverage_failed`).
 */
const BOOK = 'Heronbolt J2 speed book';
/** The envelope sweep of the whole jet takes up to 2 s on this machine; the page waits longer. */
const SWEEP_MS = 30_000;
const SHOTS = process.env['E2E_SCREENSHOT_DIR'];

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser.close();
});

async function signedIn(role: string, path: string): Promise<Page> {
  const page = await newPage(browser);
  await signIn(page, `${role}@demo.speedwright.example`, E2E_PASSWORD, path);
  await page.waitForURL(`**${path}`);
  return page;
}

async function screenshot(page: Page, name: string): Promise<void> {
  if (!SHOTS) return;
  mkdirSync(SHOTS, { recursive: true });
  await page.screenshot({ path: join(SHOTS, name), fullPage: true });
}

async function startDraft(engineer: Page, summary: string): Promise<void> {
  await engineer.goto('/speed-books');
  await engineer.getByRole('link', { name: BOOK }).click();
  await engineer.getByLabel('Change summary').fill(summary);
  await engineer.getByRole('button', { name: 'Start draft' }).click();
  await engineer.waitForURL('**/drafts?revision=*');
}

describe('coverage picture in Chromium', () => {
  it('shows an engineer the gap a cut table leaves, refuses submit with 422, and shows an approver the picture in review', async () => {
    const engineer = await signedIn('engineer', '/speed-books');
    await startDraft(engineer, 'VR table cut at the top (coverage test).');
    const live = engineer.getByTestId('live-coverage');
    await expectText(engineer.getByTestId('coverage-state'), 'Checked on the server for the content as it stands now.', SWEEP_MS);
    expect(await live.locator('button.cell[data-outcome="refused"]').count()).toBe(0);

    // Cut VR's highest pressure-altitude column: the table now stops below the envelope's top.
    const vr = engineer.getByTestId('speed-editor').filter({ has: engineer.locator('legend', { hasText: /^VR:/ }) });
    await vr.locator('input[aria-label^="Pressure altitude of column"]').first().waitFor();
    const columns = await vr.locator('input[aria-label^="Pressure altitude of column"]').count();
    const oatPages = Math.max(1, await vr.locator('input[aria-label^="OAT of page"]').count());
    const perPage = columns / oatPages;
    await vr.getByRole('button', { name: `Remove pressure-altitude column ${perPage}` }).first().click();
    await engineer.getByRole('button', { name: 'Save draft' }).click();
    await expectText(engineer.getByTestId('editor-status'), 'Draft saved.');

    // The live picture marks the points the table no longer covers, with the table's sentence.
    await expectText(engineer.getByTestId('coverage-state'), 'Checked on the server for the content as it stands now.', SWEEP_MS);
    const refused = live.locator('button.cell[data-outcome="refused"]');
    await refused.first().waitFor({ timeout: SWEEP_MS });
    expect(await refused.count()).toBeGreaterThan(0);
    await refused.first().focus();
    const gapSheet = live.getByTestId('coverage-sheet').filter({ has: engineer.locator('button.cell[data-outcome="refused"]') });
    await expectText(gapSheet.first().getByTestId('coverage-detail'), 'card refused');
    expect(await live.getByTestId('coverage-verdict').innerText()).toContain('The book does not yet cover its envelope.');
    await screenshot(engineer, 'e2e-editor-gap.png');

    // Submitting is refused with 422 coverage_failed: the sentence and the picture, the draft kept.
    const submitted = engineer.waitForResponse((r) => /\/api\/revisions\/\d+\/submit$/.test(r.url()));
    await engineer.getByRole('button', { name: 'Submit for review' }).click();
    const answer = await submitted;
    expect(answer.status()).toBe(422);
    await expectText(engineer.getByTestId('coverage-submit-refusal'), 'Submitting was refused:', SWEEP_MS);
    expect(engineer.url()).toContain('/drafts?revision=');
    expect(await live.locator('button.cell[data-outcome="refused"]').count()).toBeGreaterThan(0);
    await screenshot(engineer, 'e2e-editor-422.png');

    // The cut draft is discarded; an untouched one from the published content goes to review.
    await engineer.getByTestId('discard-draft').click();
    await engineer.getByTestId('confirm-discard-draft').click();
    await engineer.waitForURL('**/drafts');
    await startDraft(engineer, 'Republished unchanged (coverage test).');
    await expectText(engineer.getByTestId('coverage-state'), 'Checked on the server for the content as it stands now.', SWEEP_MS);
    await engineer.getByRole('button', { name: 'Submit for review' }).click();
    await engineer.waitForURL('**/speed-books?book=*', { timeout: SWEEP_MS });
    await engineer.context().close();

    // The approver sees the picture of the revision under review before deciding.
    const approver = await signedIn('approver', '/review');
    await approver.getByTestId('review-list').getByRole('link', { name: BOOK }).click();
    await approver.waitForURL('**/review?revision=*');
    const coverage = approver.getByTestId('review-coverage');
    await expectText(coverage.getByTestId('coverage-verdict'), 'The book gives a card everywhere in its envelope.', SWEEP_MS);
    expect(await coverage.getByTestId('coverage-sheet').count()).toBeGreaterThan(0);
    expect(await coverage.locator('button.cell[data-outcome="issued"]').count()).toBeGreaterThan(0);
    await expectText(coverage.getByTestId('recorded-exceptions'), 'Exceptions the engineer recorded');
    await screenshot(approver, 'e2e-review.png');
    await approver.context().close();
  });
});
