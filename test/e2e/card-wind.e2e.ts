import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { readPdf } from '../api/read-pdf';
import { baseUrl, launchBrowser } from './browser';
import { E2E_PASSWORD } from './constants';
import { chooseAirframe, expectText, signInThroughPage as signIn } from './page-helpers';

/**
 * A pilot enters a gusty crosswind for the demo trainer ZZ-KFA in Chromium and reads the wind
 * components and the approach speed on screen and in the printed PDF. Worked by hand (resolution
 * of the wind along and across the runway; flight-physics.md, "The day's wind"): runway 270°,
 * wind 300° 20 kt gusting 30 kt → headwind 20·cos 30° = 17.32 → 17 kt, crosswind 20·sin 30° =
 * 10 kt from the right; in the gusts 30·cos 30° = 25.98 → 26 kt and 30·sin 30° = 15 kt. The
 * demo operator's policy is the common practice (from memory): ½ × 17.32 + (30 − 20) = 18.66,
 * within 5–20 kt, rounded up → 19 kt, so the approach speed is VREF + 19.
 * Invented demo data — not for flight.
 */
const REGISTRATION = 'ZZ-KFA';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());

async function fill(on: Page, testId: string, value: string): Promise<void> {
  await on.getByTestId(testId).fill(value);
}

const AXE_SOURCE = readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');

/** A page whose CSP lets axe-core be injected (the app's CSP forbids inline scripts). */
async function page(viewport = { width: 1024, height: 768 }): Promise<Page> {
  const context = await browser.newContext({ baseURL: baseUrl(), viewport, bypassCSP: true });
  return context.newPage();
}

/** axe-core's WCAG 2.0/2.1 level A and AA rules (the tags of axe-core 4.x). */
async function axeViolations(on: Page): Promise<string[]> {
  // Measured mid-transition, an error line fading in has the contrast of half its colour: wait for the page to be still.
  await on.waitForFunction('document.getAnimations().length === 0');
  await on.addScriptTag({ content: AXE_SOURCE });
  const violations = await on.evaluate<{ id: string; nodes: { target: string[] }[] }[]>(
    `axe.run(document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] } }).then((r) => r.violations)`,
  );
  return violations.map((v) => `${v.id} (${v.nodes.map((n) => n.target.join(' ')).join(', ')})`);
}

describe('the day’s wind in Chromium', () => {
  it('shows the components and the approach speed of a gusty crosswind on screen and in the PDF', async () => {
    const pilot = await page();
    // The caution on screen is text with an icon and the word "Caution", never colour alone; axe checks the rest below.
    await signIn(pilot, 'pilot@demo.speedwright.example', E2E_PASSWORD, '/cards');
    await pilot.waitForURL('**/cards');
    await chooseAirframe(pilot, REGISTRATION);
    await expectText(pilot.getByTestId('departure-wind-reference'), 'degrees magnetic');

    // A gust below the steady wind is refused at the gust field, in a sentence.
    await fill(pilot, 'input-departure.runwayHeading', '270');
    await fill(pilot, 'input-departure.windDirection', '300');
    await fill(pilot, 'input-departure.windSpeed', '20');
    await fill(pilot, 'input-departure.windGust', '15');
    await expectText(pilot.getByTestId('problem-departure.windGust'), 'The gust must be at least the steady wind speed.');
    await fill(pilot, 'input-departure.windGust', '30');

    await expectText(pilot.getByTestId('approach-policy'), 'Additive 19 kt, by your operator');
    const wind = pilot.getByTestId('card-wind-components');
    await expectText(wind.getByTestId('headwind'), 'headwind 17 kt');
    await expectText(wind.getByTestId('crosswind'), 'crosswind 10 kt from the right');
    const vrefIas = Number(await pilot.locator('[data-testid="card-speeds"] tr[data-code="VREF"] td[data-column="ias"]').innerText());
    const approach = pilot.getByTestId('approach-speed');
    expect(Number(await approach.getAttribute('data-kt'))).toBe(vrefIas + 19);
    await expectText(approach, `= VREF ${vrefIas} + 19`);
    // The demo trainer's book states 15 kt as demonstrated: the gusts reach 15, not above, so no caution.
    expect(await pilot.getByTestId('wind-caution').count()).toBe(0);
    await expectText(pilot.getByTestId('card-caution'), "Planning aid. The approved flight manual and the operator's procedures govern.");
    expect(await pilot.locator('main').innerText()).not.toMatch(/NaN|undefined/);

    // Printed: the same approach speed, the components and the policy, on the card's two pages.
    const [download] = await Promise.all([pilot.waitForEvent('download', { timeout: 60_000 }), pilot.getByTestId('print-card').click()]);
    const path = join(mkdtempSync(join(tmpdir(), 'speedwright-wind-')), download.suggestedFilename());
    await download.saveAs(path);
    const { text, pages } = await readPdf(readFileSync(path));
    const flat = text.replace(/\s+/g, ' ');
    expect(flat).toContain(`Approach ${vrefIas + 19} KIAS = VREF + 19`);
    expect(flat).toContain('rwy 270°M · 300°M 20G30 kt · head 17 · cross 10 R');
    expect(flat).toContain('in the gusts head 26, cross 15');
    expect(flat).toContain('Approach: VREF + 19 kt, by the operator’s policy (½ headwind + gust, 5–20 kt; departure wind).');
    expect(pages).toBe(2);

    // Stronger: runway 270, wind 310/25G35 → crosswind 25·sin 40° = 16.07 → 16 kt, above the book's 15 kt: a caution, not a refusal.
    await fill(pilot, 'input-departure.windDirection', '310');
    await fill(pilot, 'input-departure.windSpeed', '25');
    await fill(pilot, 'input-departure.windGust', '35');
    await expectText(pilot.getByTestId('wind-caution'), 'exceeds the 15 kt crosswind the flight manual states as demonstrated');
    expect(await pilot.getByTestId('speed-card').count()).toBe(1);
    expect(await axeViolations(pilot)).toEqual([]);
    await pilot.context().close();
  });

  it('lets an administrator read and set the approach policy, with no accessibility violation', async () => {
    const admin = await page({ width: 390, height: 844 });
    await signIn(admin, 'admin@demo.speedwright.example', E2E_PASSWORD, '/operator-settings');
    await expectText(admin.getByTestId('policy-preview'), 'half the steady headwind plus the whole gust increment, at least 5 kt and at most 20 kt');
    // runway 270, wind 300/20G30: ½ × 17.32 + 10 = 18.66 → 19 kt with the common practice
    await expectText(admin.getByTestId('policy-preview'), 'VREF + 19 kt');
    await admin.getByTestId('policy-maximumKt').fill('4');
    await admin.getByTestId('save-approach-policy').click();
    await expectText(admin.getByTestId('approach-policy-status'), 'not saved');
    expect(await axeViolations(admin)).toEqual([]);
    await admin.context().close();
  });
});