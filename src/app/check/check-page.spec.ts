import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, DeferBlockBehavior, DeferBlockState, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { of } from 'rxjs';
import type { SessionUser } from '@shared/api/auth';
import { encodeCheckPayload } from '@shared/card-check/check-url';
import { generateCardCode } from '@shared/card-check/card-code';
import type { VerifySource } from '@shared/card-check/verify-api';
import { buildCard } from '@shared/card/build-card';
import { signedRevisionStatement } from '@shared/speed-book/signature';
import { HAND_CONTEXT, handPistonContent, handPistonInputs, revisionOf } from '@shared/card/testing/test-fixtures';
import { AuthService } from '../core/auth/auth-service';
import { CheckPage } from './check-page';
import { OfflineCheckData, type OfflineCheck } from './offline-check-data';

/** Invented test data — not for flight (shared/card/testing/test-fixtures.ts). */
const revision = revisionOf(handPistonContent());
const card = buildCard(revision, handPistonInputs(), HAND_CONTEXT);
const payload = encodeCheckPayload({ revisionId: revision.id, inputs: card.inputs, digest: card.digest });
const code = generateCardCode();
const OPERATOR_ID = 1;
const SIGNING_KEY_ID = 4;
const base64 = (bytes: ArrayBuffer) => btoa(String.fromCharCode(...new Uint8Array(bytes)));
/** The card's source as the server serves it, the revision signed with a fresh Ed25519 key (WebCrypto), as on publication. */
let source: VerifySource;
beforeAll(async () => {
  const subtle = globalThis.crypto.subtle;
  const pair = (await subtle.generateKey({ name: 'Ed25519' }, true, ['sign', 'verify'])) as CryptoKeyPair;
  const statement = signedRevisionStatement({
    operatorId: OPERATOR_ID,
    speedBookId: HAND_CONTEXT.speedBook.id,
    revisionId: revision.id,
    number: revision.number,
    contentSha256: revision.contentSha256!,
    publishedAt: revision.publishedAt!,
  });
  source = {
    digest: card.digest,
    revision: { ...revision, publishedAt: revision.publishedAt!, contentSha256: revision.contentSha256! },
    context: HAND_CONTEXT,
    signature: {
      algorithm: 'Ed25519',
      operatorId: OPERATOR_ID,
      keyId: SIGNING_KEY_ID,
      publicKey: base64(await subtle.exportKey('raw', pair.publicKey)),
      keyRetiredAt: null,
      value: base64(await subtle.sign({ name: 'Ed25519' }, pair.privateKey, new TextEncoder().encode(statement))),
    },
  };
});
const known = { status: 'current', revision: { number: 3, publishedAt: '2026-11-30T08:00:00.000Z' }, registration: 'ZZ-TST', issuedAt: '2026-12-01T09:30:00.000Z' };

const PILOT: SessionUser = {
  id: 2,
  email: 'pilot@demo.speedwright.example',
  displayName: 'Test pilot',
  role: 'pilot',
  operatorId: 1,
  operatorName: 'Kestrel Fen Aviation (demo)',
  operatorIsDemo: true,
};

describe('CheckPage', () => {
  let fixture: ComponentFixture<CheckPage>;
  let backend: HttpTestingController;
  let page: HTMLElement;
  let user: SessionUser | null;
  let offlineData: OfflineCheck | null;
  const read = jest.fn(async () => offlineData);

  beforeEach(() => {
    user = null;
    offlineData = null;
    read.mockClear();
    // jsdom has no IntersectionObserver, which `@defer (on viewport)` sets up: one that never reports.
    (globalThis as { IntersectionObserver?: unknown }).IntersectionObserver ??= class {
      observe(): void {}
      unobserve(): void {}
      disconnect(): void {}
    };
    TestBed.configureTestingModule({
      // The card view is deferred until it is in view; settle() renders it.
      deferBlockBehavior: DeferBlockBehavior.Manual,
      imports: [CheckPage],
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: AuthService, useValue: { session: () => of(user), user: () => user } },
        { provide: OfflineCheckData, useValue: { read } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
  });
  afterEach(() => backend.verify());

  /** Also scrolls the deferred card view into being (`@defer (on viewport)`; jsdom has no viewport). */
  async function settle(): Promise<void> {
    for (let i = 0; i < 5; i++) await new Promise((done) => setTimeout(done, 0));
    await fixture.whenStable();
    for (const block of await fixture.getDeferBlocks()) await block.render(DeferBlockState.Complete);
    await fixture.whenStable();
  }

  /**
   * settle(), then waits (at most 5 s) until the page has finished checking: after the card's
   * source arrives, the signature check (WebCrypto) and the figures' re-derivation run on their
   * own time, longer than settle()'s few turns on a loaded machine.
   */
  async function settleAnswer(): Promise<void> {
    await settle();
    const deadline = Date.now() + 5000;
    while (page.querySelector('mat-progress-bar[aria-label="Checking the card"]') && Date.now() < deadline) {
      await new Promise((done) => setTimeout(done, 20));
      await settle();
    }
  }

  async function open(codeText: string, c?: string): Promise<void> {
    fixture = TestBed.createComponent(CheckPage);
    fixture.componentRef.setInput('code', codeText);
    if (c !== undefined) fixture.componentRef.setInput('c', c);
    page = fixture.nativeElement;
    await settle();
  }

  const text = (testId: string) => page.querySelector(`[data-testid="${testId}"]`)?.textContent?.replace(/\s+/g, ' ').trim() ?? null;

  it('shows a current card, its facts, and the figures re-derived with the caution', async () => {
    await open(code, payload);
    backend.expectOne(`/api/verify/${code}`).flush(known);
    await settle();
    backend.expectOne(`/api/verify/${code}/source`).flush(source);
    await settleAnswer();
    expect(text('check-status-title')).toBe('Revision in force');
    expect(text('check-registration')).toBe('ZZ-TST');
    expect(text('check-revision')).toBe('3, published 30 Nov 2026, 08:00 UTC');
    expect(text('check-issued')).toBe('1 Dec 2026, 09:30 UTC');
    expect(page.querySelector('[data-testid="check-figures-result"]')?.getAttribute('data-outcome')).toBe('matches');
    expect(page.querySelector('[data-testid="speed-card"]')?.getAttribute('data-digest')).toBe(card.digest);
    expect(text('check-caution')).toContain("The approved flight manual and the operator's procedures govern.");
    expect(text('card-demo-mark')).toContain('invented demo data — not for flight');
    expect(text('check-signature')).toBe('Verified with the operator’s key No. 4');
  });

  it('verifies a revision signed with a key a rotation retired, and refuses one whose signature does not verify', async () => {
    await open(code, payload);
    backend.expectOne(`/api/verify/${code}`).flush({ ...known, status: 'superseded' });
    await settle();
    backend.expectOne(`/api/verify/${code}/source`).flush({ ...source, signature: { ...source.signature, keyRetiredAt: '2026-12-05T21:00:00.000Z' } });
    await settleAnswer();
    expect(page.querySelector('[data-testid="check-signature"]')?.getAttribute('data-outcome')).toBe('verified');
    expect(text('check-signature')).toBe('Verified with the operator’s key No. 4, retired 5 Dec 2026, 21:00 UTC (it still verifies what it signed)');

    const other = generateCardCode();
    await open(other, payload);
    backend.expectOne(`/api/verify/${other}`).flush(known);
    await settle();
    // The revision number changed after signing: the signature no longer covers it.
    backend.expectOne(`/api/verify/${other}/source`).flush({ ...source, revision: { ...source.revision, number: source.revision.number + 1 } });
    await settleAnswer();
    const refusal = page.querySelector('[data-testid="check-signature"]');
    expect(refusal?.getAttribute('data-outcome')).toBe('refused');
    expect(refusal?.getAttribute('role')).toBe('alert');
    expect(text('check-signature')).toContain('The revision this card was built from does not verify: its signature does not verify with the operator’s public key No. 4');
  });

  it.each([
    ['superseded', 'Replaced by a newer revision', 'Do not use this card'],
    ['withdrawn', 'Revision withdrawn', 'may no longer be used'],
  ])('says %s in words', async (status, title, sentence) => {
    await open(code);
    backend.expectOne(`/api/verify/${code}`).flush({ ...known, status });
    await settle();
    expect(text('check-status-title')).toBe(title);
    expect(text('check-status')).toContain(sentence);
    expect(text('check-figures-result')).toContain('A typed code carries no figures');
  });

  it('says when the figures do not match, and shows none of them', async () => {
    const other = buildCard(revision, { ...handPistonInputs(), weightKg: 950 }, HAND_CONTEXT);
    await open(code, encodeCheckPayload({ revisionId: revision.id, inputs: other.inputs, digest: other.digest }));
    backend.expectOne(`/api/verify/${code}`).flush(known);
    await settle();
    backend.expectOne(`/api/verify/${code}/source`).flush(source);
    await settleAnswer();
    expect(text('check-figures-result')).toContain('The figures in this code do not match the card that was issued.');
    expect(page.querySelector('[data-testid="speed-card"]')).toBeNull();
    // Said before the status of the issued card, which would otherwise read as all clear.
    const figures = page.querySelector('[data-testid="check-figures"]')!;
    const status = page.querySelector('[data-testid="check-status"]')!;
    expect(figures.compareDocumentPosition(status) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
  });

  it('a card printed under the earlier card rules (payload version 1): its digest is compared with the issued card’s, its figures not re-derived', async () => {
    // An issued card's digest from before issue 11 (any 64 hex digits stand for it here).
    const earlierDigest = 'ab'.repeat(32);
    const earlier = '1' + encodeCheckPayload({ revisionId: revision.id, inputs: card.inputs, digest: earlierDigest }).slice(1);
    await open(code, earlier);
    backend.expectOne(`/api/verify/${code}`).flush(known);
    await settle();
    backend.expectOne(`/api/verify/${code}/source`).flush({ ...source, digest: earlierDigest });
    await settleAnswer();
    expect(page.querySelector('[data-testid="check-figures-result"]')?.getAttribute('data-outcome')).toBe('none');
    expect(text('check-figures-result')).toContain('The digest in this code is the digest of the card issued under it. The card was made under an earlier version');
    expect(page.querySelector('[data-testid="speed-card"]')).toBeNull();
  });

  it('asks for what the card was built from beside the verdict, not after it', async () => {
    await open(code, payload);
    // Both requests are out before either is answered: one round trip on a phone's network.
    const verify = backend.expectOne(`/api/verify/${code}`);
    const sourceRequest = backend.expectOne(`/api/verify/${code}/source`);
    sourceRequest.flush(source);
    await settle();
    // No verdict yet, so no figures either: a check of figures is said only beside the card's status.
    expect(text('check-status-title')).toBeNull();
    expect(page.querySelector('[data-testid="speed-card"]')).toBeNull();
    verify.flush(known);
    await settle();
    expect(text('check-status-title')).toBe('Revision in force');
    expect(page.querySelector('[data-testid="check-figures-result"]')?.getAttribute('data-outcome')).toBe('matches');
  });

  it('gives the verdict when what the card was built from cannot be had, and says the figures were not checked', async () => {
    await open(code, payload);
    backend.expectOne(`/api/verify/${code}/source`).flush(null, { status: 503, statusText: 'Service Unavailable' });
    backend.expectOne(`/api/verify/${code}`).flush(known);
    await settle();
    expect(text('check-status-title')).toBe('Revision in force');
    expect(page.querySelector('[data-testid="check-figures-result"]')?.getAttribute('data-outcome')).toBe('none');
    expect(text('check-figures-result')).toContain('The figures could not be checked');
    expect(page.querySelector('[data-testid="speed-card"]')).toBeNull();
  });

  it('names an unknown code and reads nothing more', async () => {
    await open(code, payload);
    backend.expectOne(`/api/verify/${code}`).flush({ status: 'unknown' });
    // Asked for beside the verdict; the server has no card behind the code and says so.
    backend.expectOne(`/api/verify/${code}/source`).flush({ error: 'not_found', message: 'No card was issued with this code.' }, { status: 404, statusText: 'Not Found' });
    await settle();
    expect(text('check-status-title')).toBe('No card with this code here');
    expect(text('check-figures-result')).toContain('cannot be checked');
  });

  it('refuses a mistyped code with its sentence, without asking the server', async () => {
    const typo = `${code.slice(0, 8)}${code[8] === '2' ? '3' : '2'}`;
    await open(typo);
    expect(text('check-invalid')).toContain('does not fit the others');
  });

  it('offline and signed in: re-derives from the device’s data and says what it cannot know', async () => {
    user = PILOT;
    offlineData = {
      lastSyncedAt: '2026-12-01T07:00:00.000Z',
      revision: { number: 3, publishedAt: '2026-11-30T08:00:00.000Z', status: 'published' },
      newer: null,
      source: { revision, context: HAND_CONTEXT },
    };
    await open(code, payload);
    backend.expectOne(`/api/verify/${code}`).error(new ProgressEvent('error'), { status: 0 });
    backend.expectOne(`/api/verify/${code}/source`).error(new ProgressEvent('error'), { status: 0 });
    await settle();
    expect(read).toHaveBeenCalledWith(PILOT.operatorId, revision.id, card.inputs.airframeId);
    expect(text('check-status-title')).toBe('No network: checked against this device’s data');
    expect(text('check-offline-knows')).toContain('at its last sync, 1 Dec 2026, 07:00 UTC, shows revision 3 (published 30 Nov 2026, 08:00 UTC) as the revision in force');
    expect(text('check-offline-unknown')).toContain('Whether a newer revision was published, or this one withdrawn, since 1 Dec 2026, 07:00 UTC.');
    expect(text('check-figures-result')).toContain('this device’s copy of revision 3');
    expect(page.querySelector('[data-testid="speed-card"]')?.getAttribute('data-digest')).toBe(card.digest);
  });

  it('offline with a newer revision on the device: the card is no longer in force', async () => {
    user = PILOT;
    offlineData = {
      lastSyncedAt: '2026-12-01T07:00:00.000Z',
      revision: { number: 3, publishedAt: '2026-11-30T08:00:00.000Z', status: 'superseded' },
      newer: { number: 4, publishedAt: '2026-12-01T06:00:00.000Z', status: 'published' },
      source: { revision, context: HAND_CONTEXT },
    };
    await open(code, payload);
    backend.expectOne(`/api/verify/${code}`).flush(null, { status: 504, statusText: 'Gateway Timeout' });
    backend.expectOne(`/api/verify/${code}/source`).flush(null, { status: 504, statusText: 'Gateway Timeout' });
    await settle();
    expect(text('check-offline-knows')).toContain('already replaced by a newer revision');
    expect(text('check-offline-knows')).toContain('It already holds revision 4');
  });

  it('offline and signed out: says nothing can be checked here and how to prepare the device', async () => {
    await open(code, payload);
    backend.expectOne(`/api/verify/${code}`).error(new ProgressEvent('error'), { status: 0 });
    backend.expectOne(`/api/verify/${code}/source`).error(new ProgressEvent('error'), { status: 0 });
    await settle();
    expect(read).not.toHaveBeenCalled();
    expect(text('check-status-title')).toBe('No network: this card cannot be checked here now');
    expect(text('check-offline-unknown')).toContain('Whether the revision this card was built from is still in force');
    expect(page.textContent).toContain('sign in on this device while it has a connection');
  });
});
