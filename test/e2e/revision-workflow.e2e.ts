import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, newPage } from './browser';
import { E2E_PASSWORD } from './constants';
import { expectText, signInThroughPage as signIn } from './page-helpers';

/**
 * The revision workflow through Chromium, on the seeded demo: revision 2 of the trainer's speed
 * book is published. An engineer drafts revision 3 with a CSV position-error table (first with a
 * bad row, then corrected) and submits it; an approver compares and publishes; a pilot sees it.
 */
const BOOK = 'Sedgeling 4 speed book';

/** The trainer's flaps-up table with four CAS figures changed; the bad one has a decimal comma. */
const positionErrorCsv = (cas100: string) =>
  ['configuration_key,ias_kt,cas_kt', 'clean,30,40', 'clean,60,63', 'clean,80,81', `clean,100,${cas100}`, 'clean,120,118', 'clean,140,137', 'clean,160,156', ''].join('\n');

let browser: Browser;
let folder: string;
beforeAll(async () => {
  browser = await launchBrowser();
  folder = mkdtempSync(join(tmpdir(), 'speedwright-e2e-csv-'));
});
afterAll(async () => {
  await browser.close();
  rmSync(folder, { recursive: true, force: true });
});

function csvFile(name: string, text: string): string {
  const path = join(folder, name);
  writeFileSync(path, text);
  return path;
}

async function signedIn(role: string, path: string): Promise<Page> {
  const page = await newPage(browser);
  await signIn(page, `${role}@demo.speedwright.example`, E2E_PASSWORD, path);
  await page.waitForURL(`**${path}`);
  return page;
}

describe('revision workflow in Chromium', () => {
  it('takes a CSV-corrected draft from an engineer through an approver to the pilots', async () => {
    // The engineer starts revision 3 from the published revision 2.
    const engineer = await signedIn('engineer', '/speed-books');
    await engineer.getByRole('link', { name: BOOK }).click();
    await expectText(engineer.getByTestId('current-revision'), 'Current: revision 2');
    await engineer.getByLabel('Change summary').fill('Flaps-up position error from the new calibration flight (CSV).');
    await engineer.getByRole('button', { name: 'Start draft' }).click();
    await engineer.waitForURL('**/drafts?revision=*');
    await expectText(engineer.locator('h1'), 'Revision 3');

    // A row with a decimal comma is marked with its reason, and the preview cannot be accepted.
    await engineer.getByTestId('csv-file').setInputFiles(csvFile('clean-bad.csv', positionErrorCsv('"99,5"')));
    await expectText(engineer.getByTestId('csv-verdict'), '1 row has problems');
    const badRow = engineer.locator('tr.bad-row');
    expect(await badRow.count()).toBe(1);
    expect(await badRow.getAttribute('data-line')).toBe('5');
    await expectText(badRow, 'Use a point as the decimal separator: 99.5, not 99,5.');
    expect(await engineer.getByTestId('accept-preview').isDisabled()).toBe(true);

    // The corrected file previews clean, is accepted into the draft and saved.
    await engineer.getByTestId('csv-file').setInputFiles(csvFile('clean.csv', positionErrorCsv('99.5')));
    await expectText(engineer.getByTestId('csv-verdict'), '7 rows read, no problems');
    expect(await engineer.locator('tr.bad-row').count()).toBe(0);
    await engineer.getByTestId('accept-preview').click();
    await expectText(engineer.getByTestId('upload-changes'), 'Position-error table of clean: 7 points.');
    await expectText(engineer.getByTestId('editor-status'), 'Draft saved.');
    await expectText(engineer.getByTestId('problem-summary'), 'The content is complete and consistent.');

    await engineer.getByRole('button', { name: 'Submit for review' }).click();
    await engineer.waitForURL('**/speed-books?book=*');
    const history = engineer.getByTestId('revision-history');
    await expectText(history.locator('tbody tr').first(), 'In review');
    await engineer.context().close();

    // The approver sees the changed CAS figures against revision 2 and publishes.
    const approver = await signedIn('approver', '/review');
    await approver.getByTestId('review-list').getByRole('link', { name: BOOK }).click();
    await approver.waitForURL('**/review?revision=*');
    const diff = approver.getByTestId('diff-table');
    await expectText(diff, 'Configuration clean › position-error row 4 › CAS (kt)');
    const row = diff.locator('tr', { hasText: 'configurations[clean].positionError.3.casKt' });
    expect(await row.locator('td.before').innerText()).toBe('100 kt');
    expect(await row.locator('td.after').innerText()).toBe('99.5 kt');
    expect(await diff.locator('tbody tr').count()).toBe(4);
    await approver.getByTestId('publish').click();
    await expectText(approver.getByTestId('review-outcome'), 'Revision 3 is published and signed');
    await approver.context().close();

    // A pilot's list now names revision 3 as current, and its history shows 2 as superseded.
    const pilot = await signedIn('pilot', '/speed-books');
    const listed = pilot.getByTestId('speed-book-list').locator('tr', { hasText: BOOK });
    await expectText(listed, 'Revision 3');
    await pilot.getByRole('link', { name: BOOK }).click();
    await expectText(pilot.getByTestId('current-revision'), 'Current: revision 3');
    await expectText(pilot.getByTestId('revision-history').locator('tbody tr').nth(1), 'Superseded');
    await expectText(pilot.locator('[data-testid="safety-caution"]'), "The approved flight manual and the operator's procedures govern.");
    await pilot.context().close();
  });
});
