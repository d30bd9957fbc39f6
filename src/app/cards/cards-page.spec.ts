import { decodeCheckPayload } from '@shared/card-check/check-url';
import { provideRouter } from '@angular/router';
import 'fake-indexeddb/auto';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, computed, input, signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import type { SessionUser } from '@shared/api/auth';
import type { AircraftTypeView, AirframeView } from '@shared/api/fleet';
import type { RevisionView } from '@shared/api/revisions';
import { buildCard, type CardInputs, type SpeedCard } from '@shared/card';
import { contentSha256 } from '@shared/speed-book/canonical';
import { demoPistonTrainerContent } from '@shared/speed-book/demo-content';
import { AuthService } from '../core/auth/auth-service';
import { DeviceStore, SpeedwrightDeviceDatabase, type RevisionRecord } from '../core/storage/device-store';
import { DAY_MS, dataCurrency, type RevisionNotice } from '../core/sync/device-sync';
import { SyncService, type DeviceSnapshot, type SyncStatus } from '../core/sync/sync-service';
import { AltitudeChart } from './altitude-chart';
import { VirtualTimeScheduler } from 'rxjs';
import { CardsPage } from './cards-page';
import { CARD_FORM_SCHEDULER } from './card-form-model';
import { CARD_PATHS } from './card-sources';
import { SpeedCardView } from './speed-card-view';
import { CardPrinter } from './card-printer';
import type { TDocumentDefinitions } from 'pdfmake/interfaces';

/** jsdom has no canvas; the chart has its own checks (altitude-series), the page test needs only its place. */
@Component({ selector: 'sw-altitude-chart', template: '' })
class ChartPlaceholder {
  readonly card = input.required<SpeedCard>();
}

const stamp = '2026-11-01T00:00:00.000Z';
const PILOT: SessionUser = { id: 3, email: 'pilot@demo.example', displayName: 'Ines Marlow', role: 'pilot', operatorId: 1, operatorName: 'Kestrel Fen Aviation (demo)', operatorIsDemo: true };
const TYPE: AircraftTypeView = { id: 1, designator: 'ZZP1', name: 'Sedgeling 4', category: 'piston-single', engines: 1, ceilingFt: 14000, createdAt: stamp, updatedAt: stamp };
const AIRFRAME: AirframeView = { id: 7, registration: 'ZZ-KFA', serial: 'SG4-0012', aircraftTypeId: 1, active: true, createdAt: stamp, updatedAt: stamp };
const content = demoPistonTrainerContent();
const REVISION: RevisionView = {
  id: 21,
  speedBookId: 4,
  number: 1,
  status: 'published',
  changeSummary: 'First issue.',
  authorId: 2,
  authorName: 'Tobias Wren',
  submittedAt: stamp,
  approverId: 5,
  approverName: 'Ada Okonjo',
  publishedAt: '2026-11-30T08:00:00.000Z',
  supersededAt: null,
  withdrawnAt: null,
  contentSha256: contentSha256(content),
  createdAt: stamp,
  updatedAt: stamp,
  content: content as unknown as Record<string, unknown>,
  returnedAt: null,
  returnReason: null,
  withdrawnById: null,
  withdrawReason: null,
  signature: null,
  signingKeyId: null,
  problems: {},
  contributors: [],
};
const CONTEXT = {
  airframe: { id: 7, registration: 'ZZ-KFA' },
  aircraftType: { designator: 'ZZP1', name: 'Sedgeling 4' },
  speedBook: { id: 4, title: 'Sedgeling 4 speed book' },
  demo: true,
};
const SYNCED_AT = '2026-12-01T09:00:00.000Z';
const NOW = new Date(Date.parse(SYNCED_AT) + 2 * 60 * 60_000);
const STORED: RevisionRecord = {
  id: 21,
  speedBookId: 4,
  speedBookTitle: 'Sedgeling 4 speed book',
  aircraftTypeId: 1,
  number: 1,
  status: 'published',
  publishedAt: REVISION.publishedAt!,
  supersededAt: null,
  withdrawnAt: null,
  content: REVISION.content,
  contentSha256: REVISION.contentSha256!,
  signature: 'c2lnbmF0dXJl',
  signingKeyId: 9,
  operatorId: 1,
  verifiedAt: SYNCED_AT,
};
const snapshotWith = (revisions: RevisionRecord[], lastSyncedAt = SYNCED_AT): DeviceSnapshot => ({
  operator: { id: 1, name: 'Kestrel Fen Aviation (demo)', isDemo: true, publicKey: 'a2V5', signingKeyId: 9, currencyLimitDays: 30, approachAdditivePolicy: { headwindFraction: 0.5, gustFraction: 1, minimumKt: 5, maximumKt: 20 } },
  state: { operatorId: 1, cursor: 'c1', lastSyncedAt, lastAttemptAt: lastSyncedAt, lastProblem: null, refused: [] },
  aircraftTypes: [{ ...TYPE, operatorId: 1 }],
  airframes: [{ ...AIRFRAME, operatorId: 1 }],
  revisions,
});

/** The sync service as the page sees it: the device's data, no network. */
class FakeSync {
  readonly snapshot = signal<DeviceSnapshot | null>(snapshotWith([STORED]));
  readonly status = signal<SyncStatus>({ phase: 'succeeded', problem: null, retryAt: null, summary: 'Synced: nothing new.' });
  readonly notices = signal<RevisionNotice[]>([]);
  readonly now = signal(NOW);
  readonly currency = computed(() => {
    const snapshot = this.snapshot();
    return snapshot ? dataCurrency(snapshot.state, snapshot.operator?.currencyLimitDays, this.now()) : null;
  });
  reload = jest.fn(async () => undefined);
  syncNow = jest.fn();
  readonly dataVersion = signal(0);
}

const card = (inputs: CardInputs) => buildCard({ id: 21, number: 1, publishedAt: REVISION.publishedAt, contentSha256: REVISION.contentSha256!, content }, inputs, CONTEXT);

jest.setTimeout(30_000);

const pause = (ms: number) => new Promise((done) => setTimeout(done, ms));

describe('CardsPage', () => {
  let fixture: ComponentFixture<CardsPage>;
  let backend: HttpTestingController;
  let page: HTMLElement;
  let db: SpeedwrightDeviceDatabase;
  let sync: FakeSync;
  /** The typing pause runs on this virtual clock: `settle` flushes it instead of waiting. */
  let clock: VirtualTimeScheduler;

  let printer: { download: jest.Mock };

  beforeEach(async () => {
    sync = new FakeSync();
    clock = new VirtualTimeScheduler();
    printer = { download: jest.fn(async () => new Blob(['%PDF-'])) };
    localStorage.clear();
    db = new SpeedwrightDeviceDatabase(`speedwright-test-${Math.random()}`);
    TestBed.configureTestingModule({
      imports: [CardsPage],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
        { provide: AuthService, useValue: { user: signal(PILOT) } },
        { provide: DeviceStore, useValue: { db } },
        { provide: SyncService, useValue: sync },
        { provide: CardPrinter, useValue: printer },
        { provide: CARD_FORM_SCHEDULER, useValue: clock },
      ],
    });
    TestBed.overrideComponent(SpeedCardView, { remove: { imports: [AltitudeChart] }, add: { imports: [ChartPlaceholder] } });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(CardsPage);
    page = fixture.nativeElement;
    // The only airframe in service is chosen; its type's current revision comes from the device
    // store, and the device card log is read (IndexedDB, which Angular does not wait for): on a
    // loaded machine that takes longer than a fixed pause, so wait for the card itself.
    await settle();
    await until(() => page.querySelector('[data-testid="speed-card"]') !== null && page.querySelector('[data-testid="device-card-log"], .device-log .empty') !== null);
    await settle();
  });

  afterEach(async () => {
    backend.verify();
    // The page's reads of the device store end before it closes: destroy the page, then a
    // read-write transaction over every table waits for the ones already started.
    fixture.destroy();
    await db.transaction('rw', db.tables, async () => undefined);
    db.close();
    await db.delete();
  });

  /** Past the debounce (on the virtual clock), then Angular's rendering. */
  async function settle(): Promise<void> {
    await fixture.whenStable();
    clock.flush();
    await fixture.whenStable();
  }

  function field(testId: string): HTMLInputElement {
    return page.querySelector<HTMLInputElement>(`[data-testid="${testId}"]`)!;
  }

  async function type(testId: string, value: string): Promise<void> {
    const input = field(testId);
    input.value = value;
    input.dispatchEvent(new Event('input'));
    await fixture.whenStable();
  }

  function speed(code: string, column: 'ias' | 'cas'): number {
    return Number(page.querySelector(`[data-testid="card-speeds"] tr[data-code="${code}"] td[data-column="${column}"]`)!.textContent);
  }

  async function until(check: () => boolean): Promise<void> {
    let done = false;
    for (let i = 0; i < 250 && !(done = check()); i++) {
      // IndexedDB (fake-indexeddb) answers on the real event loop; the typing pause is virtual.
      await pause(20);
      clock.flush();
      await fixture.whenStable();
    }
    expect(done).toBe(true);
  }

  it('builds the card on the device from the revision, with the caution and the demo mark', () => {
    const shown = page.querySelector('[data-testid="speed-card"]')!;
    // Starting values: the reference weight 1,100 kg, ISA at sea level.
    const expected = card({
      airframeId: 7,
      weightKg: 1100,
      configuration: 'takeoff-flap',
      departure: { elevationFt: 0, qnhHpa: 1013, oatC: 15 },
      isaDeviationC: 0,
      cruise: { iasKt: 100 },
      altitudeStepFt: 1000,
    });
    expect(shown.getAttribute('data-digest')).toBe(expected.digest);
    expect(page.querySelector('[data-testid="card-registration"]')!.textContent).toBe('ZZ-KFA');
    expect(page.querySelector('[data-testid="card-revision"]')!.textContent).toContain('revision 1, published 30 Nov 2026, 08:00 UTC');
    expect(page.querySelector('[data-testid="card-caution"]')!.textContent).toContain(
      "Planning aid. The approved flight manual and the operator's procedures govern.",
    );
    expect(page.querySelector('[data-testid="card-demo-mark"]')!.textContent).toContain('invented demo data — not for flight');
    expect(page.textContent).not.toContain('NaN');
  });

  it('builds from the device store with no request, and says how old the data is', () => {
    backend.expectNone(() => true);
    expect(page.querySelector('[data-testid="card-data-as-of"]')!.textContent).toContain('Data as of 2026-12-01 09:00 UTC');
    expect(page.querySelector('[data-testid="revision-words"]')!.textContent).toContain('Revision 1, published');
  });

  it('refuses cards when the data is older than the operator’s currency limit, until a sync succeeds', async () => {
    sync.now.set(new Date(Date.parse(SYNCED_AT) + 31 * DAY_MS));
    await settle();
    expect(page.querySelector('[data-testid="speed-card"]')).toBeNull();
    expect(page.querySelector('[data-testid="issue-card"]')).toBeNull();
    expect(page.querySelector('[data-testid="currency-refusal"]')!.textContent).toContain(
      'the data on this device is from 2026-12-01 09:00 UTC, 31 days old, and your operator allows cards from data at most 30 days old',
    );
    // A sync succeeds: the data is current again.
    sync.snapshot.set(snapshotWith([STORED], new Date(Date.parse(SYNCED_AT) + 31 * DAY_MS - 60_000).toISOString()));
    await settle();
    expect(page.querySelector('[data-testid="currency-refusal"]')).toBeNull();
    expect(page.querySelector('[data-testid="speed-card"]')).not.toBeNull();
  });

  it('follows a sync that supersedes the revision: the card is built from the new one', async () => {
    const revised: RevisionRecord = { ...STORED, id: 22, number: 2, publishedAt: '2026-12-01T08:00:00.000Z' };
    sync.snapshot.set(snapshotWith([{ ...STORED, status: 'superseded', supersededAt: revised.publishedAt }, revised]));
    await settle();
    expect(page.querySelector('[data-testid="revision-words"]')!.textContent).toContain('Revision 2, published');
    expect(page.querySelector('[data-testid="card-revision"]')!.textContent).toContain('revision 2');

    // A card issued earlier from revision 1 is named in the notices and marked in the device's list.
    const issued = { id: '00000000-0000-4000-8000-000000000001', airframeId: 7, revisionId: 21, inputs: { weightKg: 1000 }, digest: 'a'.repeat(64), issuedAt: '2026-12-01T07:00:00.000Z', sentAt: '2026-12-01T07:01:00.000Z', issuedById: PILOT.id, operatorId: 1, registration: 'ZZ-KFA', revisionNumber: 1, refusal: null };
    await db.cardLog.add(issued);
    sync.notices.set([{ entry: issued, revision: { ...STORED, status: 'superseded' }, status: 'superseded', since: revised.publishedAt, current: revised, sentence: 'Your card for ZZ-KFA rests on revision 1, superseded.' }]);
    sync.dataVersion.update((n) => n + 1);
    await until(() => page.querySelector(`[data-testid="device-card-log"] li[data-entry-id="${issued.id}"]`)?.getAttribute('data-revision-status') === 'superseded');
    expect(page.querySelector(`[data-testid="device-card-log"] li[data-entry-id="${issued.id}"]`)!.textContent).toContain('(now superseded)');
    expect(page.querySelector('[data-testid="revision-notice"]')!.getAttribute('data-entry-id')).toBe(issued.id);
  });

  it('updates the card only after the pause in typing, and the weight-scaled speeds follow √(W/Wref)', async () => {
    const vs1Before = speed('VS1', 'cas');
    await type('input-weight', '800');
    // Still the old card straight after typing (debounced).
    expect(speed('VS1', 'cas')).toBe(vs1Before);
    await settle();
    // VS1: 50 KIAS at 1,100 kg → CAS 40 + (50 − 30)·(63 − 40)/(60 − 30) = 55.33 kt through the flaps-up table (demo content),
    // × √(800/1100) = 47.19 → 48 kt rounded up (stall speeds round up, flight-physics.md).
    expect(speed('VS1', 'cas')).toBe(Math.ceil((40 + (20 * 23) / 30) * Math.sqrt(800 / 1100)));
    expect(speed('VS1', 'cas')).toBeLessThan(vs1Before);
  });

  it('starts the en-route ISA deviation from the departure’s and asks to confirm one more than 20 °C away before issuing', async () => {
    // OAT +40 °C at a sea-level field on QNH 1013 is ISA +25 °C (ISO 2533: 15 °C at 0 ft; 1013 hPa is 7 ft).
    await type('input-departure.oat', '40');
    await settle();
    await settle();
    expect(field('input-isaDeviation').value).toBe('25');
    expect(page.querySelector('[data-testid="isa-confirm"]')).toBeNull();
    // The pilot types ISA −30: 55 °C from the departure's, so the card asks before it can be issued.
    await type('input-isaDeviation', '-30');
    await settle();
    expect(page.querySelector('[data-testid="isa-confirm"]')!.textContent).toContain("differs from the departure's (ISA +25 °C) by 55 °C");
    expect(page.querySelector<HTMLButtonElement>('[data-testid="issue-card"]')!.disabled).toBe(true);
    page.querySelector<HTMLInputElement>('[data-testid="confirm-isa-deviation"] input')!.click();
    await fixture.whenStable();
    expect(page.querySelector<HTMLButtonElement>('[data-testid="issue-card"]')!.disabled).toBe(false);
    // Typed by the pilot, it no longer follows the departure.
    await type('input-departure.oat', '30');
    await settle();
    expect(field('input-isaDeviation').value).toBe('-30');
  });

  it('shows the refusal sentence at the weight field and no card figures', async () => {
    await type('input-weight', '1500');
    await settle();
    expect(page.querySelector('[data-testid="problem-weight"]')!.textContent).toContain(
      'The takeoff weight 1,500 kg is above the maximum takeoff weight of 1,100 kg.',
    );
    expect(page.querySelector('[data-testid="speed-card"]')).toBeNull();
    expect(page.querySelector('[data-testid="card-refusal"]')!.textContent).toContain('No card for these inputs');
    expect(page.textContent).not.toContain('NaN');
  });

  it('switches a field to another unit, converts what is typed and remembers the choice per user', async () => {
    const digestBefore = page.querySelector('[data-testid="speed-card"]')!.getAttribute('data-digest');
    field('unit-weight').click();
    await settle();
    // 1,100 kg / 0.45359237 kg/lb (international pound) = 2,425.08 lb, shown to the pound.
    expect(field('input-weight').value).toBe('2425');
    expect(field('input-weight').closest('mat-form-field')!.querySelector('mat-label')!.textContent).toContain('Takeoff weight (lb)');
    expect(JSON.parse(localStorage.getItem(`speedwright.card-units.${PILOT.id}`)!).weight).toBe('lb');
    // 2,425 lb is 1,099.96 kg: a new card, with the entered unit and its kilograms in the header.
    expect(page.querySelector('[data-testid="speed-card"]')!.getAttribute('data-digest')).not.toBe(digestBefore);
    expect(page.querySelector('[data-testid="speed-card"] .inputs')!.textContent).toContain('2425 lb (1100 kg)');

    field('unit-departure.qnh').click();
    await settle();
    // 1013 hPa / 33.8639 hPa/inHg = 29.914 inHg, to the hundredth.
    expect(field('input-departure.qnh').value).toBe('29.91');
  });

  it('issues the card: stores it on the device, posts it and marks it sent', async () => {
    const shown = page.querySelector('[data-testid="speed-card"]')!.getAttribute('data-digest')!;
    (page.querySelector('[data-testid="issue-card"]') as HTMLButtonElement).click();
    await until(() => {
      const requests = backend.match((request) => request.url === CARD_PATHS.cardIssues && request.method === 'POST');
      if (requests.length === 0) return false;
      const { entries } = requests[0].request.body as { entries: { id: string; digest: string; airframeId: number; revisionId: number; issuedAt: string }[] };
      expect(entries).toHaveLength(1);
      expect(entries[0]).toEqual({ id: expect.stringMatching(/^[0-9a-f-]{36}$/), airframeId: 7, revisionId: 21, inputs: expect.any(Object), digest: shown, issuedAt: expect.any(String) });
      requests[0].flush({ results: [{ id: entries[0].id, outcome: 'recorded', status: 201, code: 'K7M4RTX9X', digest: shown, receivedAt: '2026-12-01T10:00:00.000Z' }] });
      return true;
    });
    await until(() => page.querySelector('[data-testid="issue-status"]')?.textContent?.includes("recorded in the operator's card log") ?? false);
    const stored = await db.cardLog.toArray();
    expect(stored).toHaveLength(1);
    expect(stored[0]).toMatchObject({ digest: shown, sentAt: '2026-12-01T10:00:00.000Z', issuedById: PILOT.id, refusal: null });
    await until(() => page.querySelector('[data-testid="device-card-log"] li')?.getAttribute('data-state') === 'sent');
    // The device's list links the card code to its check page with the figures, as the QR code does.
    expect(stored[0].code).toBe('K7M4RTX9X');
    await until(() => page.querySelector('[data-testid="device-card-code"]') !== null);
    const link = page.querySelector<HTMLAnchorElement>('[data-testid="device-card-code"]')!;
    expect(link.textContent).toContain('K7M-4RT-X9X');
    const [path, query] = link.getAttribute('href')!.split('?');
    expect(path).toBe('/check/K7M4RTX9X');
    expect(decodeCheckPayload(new URLSearchParams(query).get('c')!)).toMatchObject({ ok: true, value: { revisionId: 21, digest: shown } });
  });

  it('keeps an issued card unsent on the device when the server cannot be reached, and says so', async () => {
    (page.querySelector('[data-testid="issue-card"]') as HTMLButtonElement).click();
    await until(() => {
      const requests = backend.match(CARD_PATHS.cardIssues);
      if (requests.length === 0) return false;
      requests[0].error(new ProgressEvent('error'), { status: 0 });
      return true;
    });
    await until(() => page.querySelector('[data-testid="issue-status"]')?.textContent?.includes('Not sent yet') ?? false);
    expect(page.querySelector('[data-testid="issue-status"]')!.textContent).toContain('kept on this device');
    const stored = await db.cardLog.toArray();
    expect(stored).toHaveLength(1);
    expect(stored[0].sentAt).toBeNull();
    await until(() => page.querySelector('[data-testid="device-card-log"] li')?.getAttribute('data-state') === 'waiting');
    expect(page.querySelector('[data-testid="send-waiting"]')!.textContent).toContain('Send waiting cards (1)');
  });

  it('prints the card: issues it first, prints its code from the card log, and prints the same card again without a second entry', async () => {
    const shown = page.querySelector('[data-testid="speed-card"]')!.getAttribute('data-digest')!;
    expect(page.querySelector('[data-testid="print-hint"]')!.textContent).toContain('Printing issues the card first');
    (page.querySelector('[data-testid="print-card"]') as HTMLButtonElement).click();
    let entryId = '';
    await until(() => {
      const requests = backend.match((request) => request.url === CARD_PATHS.cardIssues && request.method === 'POST');
      if (requests.length === 0) return false;
      const { entries } = requests[0].request.body as { entries: { id: string }[] };
      entryId = entries[0].id;
      requests[0].flush({ results: [{ id: entryId, outcome: 'recorded', status: 201, code: 'K7M4RTX9X', digest: shown, receivedAt: '2026-12-01T10:00:00.000Z' }] });
      return true;
    });
    // The outbox keeps the code the server gave the entry, so the printer needs no second request.
    await until(() => printer.download.mock.calls.length === 1);
    const [definition, fileName] = printer.download.mock.calls[0] as [TDocumentDefinitions, string];
    expect(fileName).toMatch(/^ZZ-KFA-rev1-\d{4}-\d\d-\d\d\.pdf$/);
    expect(JSON.stringify(definition.content)).toContain('"canvas":[{"type":"rect"');
    const header = JSON.stringify((definition.header as (page: number, pages: number) => unknown)(1, 2));
    expect(header).toContain('K7M-4RT-X9X');
    expect(header).toContain('ZZ-KFA');
    await until(() => page.querySelector('[data-testid="print-status"]')?.textContent?.includes('Card code K7M-4RT-X9X') ?? false);
    expect(page.querySelector('[data-testid="print-status"]')!.textContent).toContain('at actual size on 5.5 × 8.5 in paper, double-sided');
    expect((await db.cardLog.toArray()).map((entry) => entry.code)).toEqual(['K7M4RTX9X']);
    backend.expectNone(`${CARD_PATHS.cardIssues}/${entryId}`);

    // Printed again: the same issued card, no second card-log entry, no request.
    (page.querySelector('[data-testid="print-card"]') as HTMLButtonElement).click();
    await until(() => printer.download.mock.calls.length === 2);
    backend.expectNone(CARD_PATHS.cardIssues);
    expect(await db.cardLog.count()).toBe(1);
    const again = printer.download.mock.calls[1][0] as TDocumentDefinitions;
    expect(JSON.stringify((again.header as (page: number, pages: number) => unknown)(1, 2))).toContain('K7M-4RT-X9X');
    expect(JSON.stringify(again.content)).toContain(`"text":"${speed('VR', 'ias')}"`);
  });
});
