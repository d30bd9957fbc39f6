import type { Browser, Page } from 'playwright-core';
import { aircraftTypeListSchema, airframeListSchema } from '@shared/api/fleet';
import { revisionResponseSchema, speedBookListSchema } from '@shared/api/revisions';
import { iasToCasKt } from '@shared/aero';
import { buildCard, type CardInputs } from '@shared/card';
import { cardIssueBatchSchema, cardIssuePageSchema } from '@shared/card/card-api';
import { revisionContentSchema } from '@shared/speed-book/revision-content';
import { roundingOfClass, speedClassOf } from '@shared/speed-book/speed-class';
import { launchBrowser, newPage } from './browser';
import { E2E_PASSWORD } from './constants';
import { chooseAirframe, expectText, signInThroughPage as signIn } from './page-helpers';

/**
 * A pilot builds a speed card in Chromium for the demo trainer ZZ-KFA: the card is computed in
 * the page as the weight is typed, the weight-scaled speeds follow V = Vref·√(W/Wref) (FAA
 * handbooks; flight-physics.md, "Weight and load factor"), a weight above the maximum refuses
 * the card at the weight field, and an issued card reaches the operator's card log with the
 * digest Node computes for the same inputs.
 */
const REGISTRATION = 'ZZ-KFA';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());


/** Types a weight and waits for the card (or the refusal) that follows it. */
async function typeWeight(page: Page, kg: number): Promise<void> {
  const before = await page.getByTestId('speed-card').getAttribute('data-digest').catch(() => null);
  await page.getByTestId('input-weight').fill(String(kg));
  const deadline = Date.now() + 10_000;
  while (Date.now() < deadline) {
    const card = page.getByTestId('speed-card');
    if ((await card.count()) === 0) {
      if ((await page.getByTestId('card-refusal').count()) > 0) return;
    } else if ((await card.getAttribute('data-digest')) !== before) {
      return;
    }
    await page.waitForTimeout(100);
  }
  throw new Error(`No new card after typing ${kg} kg.`);
}

/** CAS of every weight-scaled speed on the card, by code. */
async function scaledCas(page: Page): Promise<Record<string, { ias: number; cas: number }>> {
  const rows = page.locator('[data-testid="card-speeds"] tr[data-kind="scaled"]');
  const result: Record<string, { ias: number; cas: number }> = {};
  for (let i = 0; i < (await rows.count()); i++) {
    const row = rows.nth(i);
    const code = (await row.getAttribute('data-code'))!;
    result[code] = { ias: Number(await row.locator('td[data-column="ias"]').innerText()), cas: Number(await row.locator('td[data-column="cas"]').innerText()) };
  }
  return result;
}

describe('speed card in Chromium', () => {
  it('builds the card on the device, scales speeds by √(W/Wref), refuses a weight out of range and issues the card', async () => {
    const page = await newPage(browser);
    await signIn(page, 'pilot@demo.speedwright.example', E2E_PASSWORD, '/cards');
    await page.waitForURL('**/cards');
    await chooseAirframe(page, REGISTRATION);
    await expectText(page.getByTestId('card-caution'), "Planning aid. The approved flight manual and the operator's procedures govern.");
    await expectText(page.getByTestId('card-demo-mark'), 'invented demo data — not for flight');

    // The revision the page builds from, read through the API as the same pilot.
    const books = speedBookListSchema.parse(await (await page.request.get('/api/speed-books')).json()).speedBooks;
    const airframes = airframeListSchema.parse(await (await page.request.get('/api/airframes')).json()).airframes;
    const types = aircraftTypeListSchema.parse(await (await page.request.get('/api/aircraft-types')).json()).aircraftTypes;
    const airframe = airframes.find((a) => a.registration === REGISTRATION)!;
    const type = types.find((t) => t.id === airframe.aircraftTypeId)!;
    const book = books.find((b) => b.aircraftTypeId === type.id)!;
    const revision = revisionResponseSchema.parse(await (await page.request.get(`/api/revisions/${book.currentRevision!.id}`)).json()).revision;
    const content = revisionContentSchema.parse(revision.content);
    const referenceKg = content.weights.referenceKg!;

    // Two weights inside the flight manual's range.
    const w1 = 900;
    const w2 = 1080;
    await typeWeight(page, w1);
    const light = await scaledCas(page);
    await typeWeight(page, w2);
    const heavy = await scaledCas(page);

    const codes = Object.keys(heavy);
    expect(codes.length).toBeGreaterThanOrEqual(3);
    for (const code of codes) {
      const speed = content.speeds.find((s) => s.code === code && s.kind === 'scaled')!;
      if (speed.kind !== 'scaled') throw new Error(`${code} is not weight-scaled`);
      const table = content.configurations.find((c) => c.key === speed.configurationKey)!.positionError;
      const referenceCasKt = speed.basis === 'ias' ? iasToCasKt(table, speed.referenceKt) : speed.referenceKt;
      // Rounded by class (flight-physics.md, "Rounding by kind"): stall and minimum speeds up, limits (VA) down, others nearest.
      const rounding = roundingOfClass(speedClassOf(speed));
      const round = rounding === 'stall-up' ? Math.ceil : rounding === 'limit-down' ? Math.floor : Math.round;
      expect(light[code].cas).toBe(round(referenceCasKt * Math.sqrt(w1 / referenceKg)));
      expect(heavy[code].cas).toBe(round(referenceCasKt * Math.sqrt(w2 / referenceKg)));
      // Heavier, faster: CAS by the square-root law within the knot of rounding; IAS too, through the position error.
      expect(Math.abs(heavy[code].cas - light[code].cas * Math.sqrt(w2 / w1))).toBeLessThanOrEqual(1.5);
      expect(heavy[code].ias).toBeGreaterThan(light[code].ias);
    }

    // Above the maximum takeoff weight: the sentence at the weight field, and no card figures.
    await typeWeight(page, 1500);
    await expectText(page.getByTestId('problem-weight'), `The takeoff weight 1,500 kg is above the maximum takeoff weight of ${content.weights.maximumTakeoffKg.toLocaleString('en-GB')} kg.`);
    expect(await page.getByTestId('speed-card').count()).toBe(0);
    expect(await page.locator('main').innerText()).not.toContain('NaN');

    // Back in range, issued: the device posts the entry, and the server's card log lists it.
    await typeWeight(page, 1000);
    const shownDigest = (await page.getByTestId('speed-card').getAttribute('data-digest'))!;
    const posted = page.waitForRequest((request) => request.url().endsWith('/api/card-issues') && request.method() === 'POST');
    await page.getByTestId('issue-card').click();
    const batch = cardIssueBatchSchema.parse((await posted).postDataJSON());
    await expectText(page.getByTestId('issue-status'), "recorded in the operator's card log");
    expect(batch.entries).toHaveLength(1);
    const entry = batch.entries[0];
    expect(entry.digest).toBe(shownDigest);

    // The digest Chromium computed equals the one Node computes from the same inputs and revision.
    const nodeCard = buildCard(
      { id: revision.id, number: revision.number, publishedAt: revision.publishedAt, contentSha256: revision.contentSha256!, content: revision.content },
      entry.inputs as unknown as CardInputs,
      {
        airframe: { id: airframe.id, registration: airframe.registration },
        aircraftType: { designator: type.designator, name: type.name },
        speedBook: { id: book.id, title: book.title },
        demo: true,
      },
    );
    expect(nodeCard.digest).toBe(shownDigest);
    expect(await page.getByTestId('card-digest').innerText()).toBe(nodeCard.digest);

    const log = cardIssuePageSchema.parse(await (await page.request.get(`/api/card-issues?airframeId=${airframe.id}`)).json());
    expect(log.entries.find((listed) => listed.id === entry.id)).toMatchObject({ digest: shownDigest, airframe: { registration: REGISTRATION } });

    // On this device's card log, as sent.
    await expectText(page.locator(`[data-testid="device-card-log"] li[data-entry-id="${entry.id}"]`), 'recorded by the server');
    await page.context().close();
  });
});
