import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Browser } from 'playwright-core';
import { normaliseCardCode } from '@shared/card-check/card-code';
import { cardIssuePageSchema } from '@shared/card/card-api';
import { readPdf } from '../api/read-pdf';
import { launchBrowser, newPage } from './browser';
import { E2E_PASSWORD } from './constants';
import { chooseAirframe, expectText, signInThroughPage as signIn } from './page-helpers';

/**
 * A pilot prints a card in Chromium: "Print card" issues the card (it is not issued yet), makes
 * the PDF on the device with pdfmake and the shipped fonts, and the browser downloads it. The
 * file is a PDF with the registration, the card code from the card log and the caution; the
 * chosen paper is remembered. Invented demo data — not for flight.
 */
const REGISTRATION = 'ZZ-KFA';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());


describe('printing a card in Chromium', () => {
  it('issues the card, downloads its PDF with the registration, code and caution, and remembers the paper', async () => {
    const page = await newPage(browser);
    await signIn(page, 'pilot@demo.speedwright.example', E2E_PASSWORD, '/cards');
    await page.waitForURL('**/cards');
    await chooseAirframe(page, REGISTRATION);
    await expectText(page.getByTestId('print-hint'), 'Printing issues the card first');

    await page.getByTestId('print-paper').click();
    await page.getByRole('option', { name: 'A5 (148 × 210 mm)' }).click();
    await page.getByRole('listbox').waitFor({ state: 'detached' });

    const [download] = await Promise.all([page.waitForEvent('download', { timeout: 60_000 }), page.getByTestId('print-card').click()]);
    const today = new Date().toISOString().slice(0, 10);
    expect(download.suggestedFilename()).toMatch(new RegExp(`^${REGISTRATION}-rev\\d+-${today}\\.pdf$`));
    const path = join(mkdtempSync(join(tmpdir(), 'speedwright-print-')), download.suggestedFilename());
    await download.saveAs(path);
    const pdf = readFileSync(path);
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    // A5 is 148 × 210 mm: 419.53 × 595.28 pt (ISO 216, 72 pt to the inch).
    const box = pdf.toString('latin1').match(/\/MediaBox \[0 0 ([0-9.]+) ([0-9.]+)\]/)!;
    expect(Number(box[1])).toBeCloseTo(419.53, 1);
    expect(Number(box[2])).toBeCloseTo(595.28, 1);
    expect(pdf.toString('latin1').match(/\/FontFile2/g)).toHaveLength(4);

    // The card was issued by printing it: the status names its code, and so does the card log.
    await expectText(page.getByTestId('print-status'), 'Card code');
    const status = await page.getByTestId('print-status').innerText();
    const printedCode = status.match(/Card code ([0-9A-Z-]+)/)![1];
    const log = cardIssuePageSchema.parse(await (await page.request.get('/api/card-issues?limit=5')).json());
    expect(log.entries.map((entry) => entry.code)).toContain(normaliseCardCode(printedCode));

    const { text } = await readPdf(pdf);
    const flat = text.replace(/\s+/g, ' ');
    expect(flat).toContain(REGISTRATION);
    expect(flat).toContain(printedCode);
    expect(flat).toContain("Planning aid. The approved flight manual and the operator's procedures govern.");
    expect(flat).toContain('INVENTED DEMO DATA — NOT FOR FLIGHT');
    expect(flat).not.toMatch(/NaN|undefined/);
    await expectText(page.getByTestId('print-hint'), 'Prints the card you issued');
    await expectText(page.getByTestId('print-status'), 'at actual size on A5 paper, double-sided');

    // The paper choice is remembered on this device.
    await page.reload();
    await chooseAirframe(page, REGISTRATION);
    await expectText(page.getByTestId('print-paper'), 'A5 (148 × 210 mm)');
    await page.context().close();
  });
});
