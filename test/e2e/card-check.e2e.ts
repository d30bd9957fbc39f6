/**
 * The card check in Chromium: a pilot issues a card (as the device reports it); a stranger with
 * no account opens its check URL → the revision is in force and the figures match; a new
 * revision is published → the same URL says superseded; and the card's QR code, played to
 * Chromium as its camera (a .y4m video this test writes, the QR drawn in luma from the qrcode
 * package's module matrix), lands the scan page on the check page.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { APIRequestContext, Browser } from 'playwright-core';
import QRCode from 'qrcode';
import { checkUrl } from '@shared/card-check/check-url';
import { cardIssueBatchResponseSchema, cardPreviewResponseSchema } from '@shared/card/card-api';
import type { CardInputs } from '@shared/card';
import { demoPistonTrainerContent } from '@shared/speed-book/demo-content';
import { baseUrl, launchBrowser } from './browser';
import { E2E_PASSWORD } from './constants';
import { expectText, signInThroughPage as signIn } from './page-helpers';

let browser: Browser;
let cameraBrowser: Browser | undefined;
let dir: string;
beforeAll(async () => {
  browser = await launchBrowser();
  dir = mkdtempSync(join(tmpdir(), 'speedwright-camera-'));
});
afterAll(async () => {
  await browser?.close();
  await cameraBrowser?.close();
  rmSync(dir, { recursive: true, force: true });
});

/** A signed-in API session of a demo person (the device's calls, with the CSRF token). */
async function apiSession(email: string) {
  const context = await browser.newContext({ baseURL: baseUrl() });
  const request = context.request;
  const csrf = async () => ((await (await request.get('/api/auth/csrf')).json()) as { token: string }).token;
  const login = await request.post('/api/auth/login', { data: { email, password: E2E_PASSWORD }, headers: { 'x-csrf-token': await csrf() } });
  expect(login.status()).toBe(200);
  const token = await csrf();
  const send = async (method: 'post' | 'patch', path: string, data: unknown = {}) => {
    const res = await request[method](path, { data, headers: { 'x-csrf-token': token } });
    if (res.status() >= 300) throw new Error(`${method.toUpperCase()} ${path} answered ${res.status()}: ${await res.text()}`);
    return res.json();
  };
  return { request: request as APIRequestContext, send, close: () => context.close() };
}

/** YUV4MPEG2 (4:2:0) video of `frames` identical frames: the QR code of `text`, black modules on white, centred. */
function qrVideo(text: string, width = 640, height = 480, frames = 30): Buffer {
  const qr = QRCode.create(text, { errorCorrectionLevel: 'M' });
  const size = qr.modules.size;
  const quiet = 4;
  const scale = Math.floor(Math.min(width, height) / (size + 2 * quiet));
  const left = Math.floor((width - size * scale) / 2);
  const top = Math.floor((height - size * scale) / 2);
  const luma = Buffer.alloc(width * height, 235); // video white (ITU-R BT.601 range 16–235)
  for (let row = 0; row < size; row++) {
    for (let col = 0; col < size; col++) {
      if (!qr.modules.get(row, col)) continue;
      for (let y = 0; y < scale; y++) luma.fill(16, (top + row * scale + y) * width + left + col * scale, (top + row * scale + y) * width + left + (col + 1) * scale);
    }
  }
  const chroma = Buffer.alloc((width / 2) * (height / 2), 128);
  const frame = Buffer.concat([Buffer.from('FRAME\n'), luma, chroma, chroma]);
  return Buffer.concat([Buffer.from(`YUV4MPEG2 W${width} H${height} F10:1 Ip A1:1 C420jpeg\n`), ...Array(frames).fill(frame)]);
}

describe('checking a printed card', () => {
  let url = '';
  let code = '';
  let speedBookId = 0;
  let registration = '';
  let issuedDigest = '';

  beforeAll(async () => {
    // A fleet of its own, so other e2e files keep their revisions: a type, its book, an airframe, revision 1.
    const admin = await apiSession('admin@demo.speedwright.example');
    const engineer = await apiSession('engineer@demo.speedwright.example');
    const approver = await apiSession('approver@demo.speedwright.example');
    const pilot = await apiSession('pilot@demo.speedwright.example');
    const suffix = Date.now().toString(36).toUpperCase().slice(-3);
    const type = await admin.send('post', '/api/aircraft-types', { designator: `ZC${suffix}`, name: 'Check trainer (invented)', category: 'piston-single', engines: 1, ceilingFt: 14000 });
    registration = `ZZ-C${suffix}`;
    const airframe = await admin.send('post', '/api/airframes', { registration, serial: `CHK-${suffix}`, aircraftTypeId: type.aircraftType.id });
    speedBookId = (await engineer.send('post', '/api/speed-books', { aircraftTypeId: type.aircraftType.id, title: `Check trainer ${suffix} speed book` })).speedBook.id;
    const revisionId = await publishRevision(engineer, approver, speedBookId, 'First revision');

    // The pilot's device builds the card and reports it; the server gives its code.
    const inputs: CardInputs = {
      airframeId: airframe.airframe.id,
      weightKg: 1000,
      configuration: 'takeoff-flap',
      departure: { elevationFt: 400, qnhHpa: 1016, oatC: 18 },
      isaDeviationC: 3,
      cruise: { iasKt: 110 },
      altitudeStepFt: 2000,
    };
    const card = cardPreviewResponseSchema.parse(await pilot.send('post', '/api/cards/preview', { revisionId, inputs })).card;
    const entry = { id: crypto.randomUUID(), airframeId: inputs.airframeId, revisionId, inputs, digest: card.digest, issuedAt: new Date().toISOString() };
    const [result] = cardIssueBatchResponseSchema.parse(await pilot.send('post', '/api/card-issues', { entries: [entry] })).results;
    if (result.outcome !== 'recorded') throw new Error(result.error.message);
    code = result.code;
    issuedDigest = card.digest;
    url = checkUrl(baseUrl(), code, { revisionId, inputs: card.inputs, digest: card.digest });
    await Promise.all([admin.close(), pilot.close()]);
    engineerApprover = { engineer, approver };
  });
  let engineerApprover: { engineer: Awaited<ReturnType<typeof apiSession>>; approver: Awaited<ReturnType<typeof apiSession>> };
  afterAll(async () => {
    await engineerApprover?.engineer.close();
    await engineerApprover?.approver.close();
  });

  async function publishRevision(engineer: Awaited<ReturnType<typeof apiSession>>, approver: Awaited<ReturnType<typeof apiSession>>, bookId: number, notes: string): Promise<number> {
    const draft = await engineer.send('post', `/api/speed-books/${bookId}/revisions`, { content: { ...demoPistonTrainerContent(), notes: `${notes} (invented demo data — not for flight).` }, changeSummary: notes });
    await engineer.send('post', `/api/revisions/${draft.revision.id}/submit`);
    await approver.send('post', `/api/revisions/${draft.revision.id}/approve`);
    return draft.revision.id as number;
  }

  it('shows a stranger that the revision is in force and the figures match, with the caution', async () => {
    const context = await browser.newContext({ baseURL: baseUrl(), viewport: { width: 1024, height: 900 } });
    const page = await context.newPage();
    await page.goto(url);
    await expectText(page.getByTestId('check-status-title'), 'Revision in force', 20_000);
    expect(await page.getByTestId('check-status').getAttribute('data-status')).toBe('current');
    await expectText(page.getByTestId('check-registration'), registration);
    await expectText(page.getByTestId('check-revision'), '1, published');
    expect(await page.getByTestId('check-figures-result').getAttribute('data-outcome')).toBe('matches');
    await expectText(page.getByTestId('check-figures-result'), 'match the card that was issued');
    await expectText(page.getByTestId('check-caution'), 'The approved flight manual and the operator\'s procedures govern.');
    await expectText(page.getByTestId('card-demo-mark'), 'invented demo data — not for flight');
    // The card shown is re-derived in the page to the digest of the card issued.
    expect(await page.getByTestId('speed-card').getAttribute('data-digest')).toBe(issuedDigest);
    // Nobody is signed in: no navigation, nothing of the operator beyond the card.
    expect(await page.getByTestId('nav-list').count()).toBe(0);
    expect(await page.getByTestId('operator-name').count()).toBe(0);

    // Figures altered in the URL: the page says they do not match.
    await page.goto(url.replace('_1000_', '_990_'));
    await expectText(page.getByTestId('check-figures-result'), 'The figures in this code do not match the card that was issued.', 20_000);
    expect(await page.getByTestId('speed-card').count()).toBe(0);
    await context.close();
  });

  it('says superseded once a new revision is published', async () => {
    await publishRevision(engineerApprover.engineer, engineerApprover.approver, speedBookId, 'Second revision');
    const context = await browser.newContext({ baseURL: baseUrl() });
    const page = await context.newPage();
    await page.goto(url);
    await expectText(page.getByTestId('check-status-title'), 'Replaced by a newer revision', 20_000);
    expect(await page.getByTestId('check-status').getAttribute('data-status')).toBe('superseded');
    await expectText(page.getByTestId('check-status'), 'Do not use this card');
    await context.close();
  });

  it('reads the QR code through the camera and lands on the check page, releasing the camera', async () => {
    const video = join(dir, 'card-qr.y4m');
    writeFileSync(video, qrVideo(url));
    cameraBrowser = await launchBrowser({ fakeCameraFile: video });
    const context = await cameraBrowser.newContext({ baseURL: baseUrl(), viewport: { width: 1024, height: 900 } });
    const page = await context.newPage();
    // Count live camera tracks: every getUserMedia stream is watched, so a track left running shows.
    await page.addInitScript(() => {
      const live = new Set<MediaStreamTrack>();
      (window as unknown as { liveTracks: () => number }).liveTracks = () => [...live].filter((track) => track.readyState === 'live').length;
      const original = navigator.mediaDevices.getUserMedia.bind(navigator.mediaDevices);
      navigator.mediaDevices.getUserMedia = async (constraints) => {
        const stream = await original(constraints);
        stream.getTracks().forEach((track) => live.add(track));
        return stream;
      };
    });
    await page.goto('/scan');
    await page.waitForURL(`**/check/${code}?c=*`, { timeout: 30_000 });
    await expectText(page.getByTestId('check-status-title'), 'Replaced by a newer revision', 20_000);
    expect(await page.evaluate(() => (window as unknown as { liveTracks: () => number }).liveTracks())).toBe(0);
    await context.close();
  });

  it('offline, on a pilot’s synced device: re-derives from its data and says what it cannot know', async () => {
    const context = await browser.newContext({ baseURL: baseUrl(), viewport: { width: 1024, height: 900 } });
    const page = await context.newPage();
    await signIn(page, 'pilot@demo.speedwright.example', E2E_PASSWORD, '/home');
    await page.waitForURL('**/home');
    // The device has synced (both revisions of the book) and the service worker holds the app.
    await page.locator('[data-testid="sync-status"][data-phase="succeeded"]').first().waitFor({ timeout: 30_000 });
    await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
    if (!(await page.evaluate(() => navigator.serviceWorker.controller !== null))) await page.reload();
    const deadline = Date.now() + 60_000;
    let state = '';
    while (Date.now() < deadline && !/Driver state: NORMAL[\s\S]*Latest manifest hash: [0-9a-f]+/.test(state)) {
      state = await page.evaluate(() => fetch('/ngsw/state').then((r) => r.text()));
      await page.waitForTimeout(250);
    }
    expect(state).toMatch(/Driver state: NORMAL/);

    await context.setOffline(true);
    await page.goto(url);
    await expectText(page.getByTestId('check-status-title'), 'No network: checked against this device’s data', 20_000);
    await expectText(page.getByTestId('check-offline-knows'), 'shows revision 1');
    await expectText(page.getByTestId('check-offline-knows'), 'It already holds revision 2');
    await expectText(page.getByTestId('check-offline-unknown'), 'Whether a newer revision was published, or this one withdrawn, since');
    await expectText(page.getByTestId('check-figures-result'), 'this device’s copy of revision 1');
    expect(await page.getByTestId('speed-card').getAttribute('data-digest')).toBe(issuedDigest);
    await expectText(page.getByTestId('check-caution'), 'The approved flight manual and the operator\'s procedures govern.');
    await context.close();
  });

  it('lists the code in the operator’s card log, linked to its check page', async () => {
    const context = await browser.newContext({ baseURL: baseUrl(), viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await signIn(page, 'inspector@demo.speedwright.example', E2E_PASSWORD, '/card-log');
    await page.waitForURL('**/card-log');
    const printed = `${code.slice(0, 3)}-${code.slice(3, 6)}-${code.slice(6)}`;
    const link = page.getByTestId('log-card-code').filter({ hasText: printed });
    await link.waitFor({ timeout: 20_000 });
    await link.click();
    await page.waitForURL(`**/check/${code}`);
    await expectText(page.getByTestId('check-status-title'), 'Replaced by a newer revision', 20_000);
    await context.close();
  });

  it('checks a typed code and names a mistyped one', async () => {
    const context = await browser.newContext({ baseURL: baseUrl() });
    const page = await context.newPage();
    await page.goto('/scan');
    await page.getByTestId('scan-typed-code').fill(`${code.slice(0, 3)} ${code.slice(3, 6)} ${code.slice(6)}`.toLowerCase());
    await page.getByRole('button', { name: 'Check this code' }).click();
    await page.waitForURL(`**/check/${code}`);
    await expectText(page.getByTestId('check-status-title'), 'Replaced by a newer revision', 20_000);
    await expectText(page.getByTestId('check-figures-result'), 'A typed code carries no figures');

    await page.goto('/scan');
    const swapped = code[0] === code[1] ? `${code.slice(0, 7)}${code[8]}${code[7]}` : `${code[1]}${code[0]}${code.slice(2)}`;
    await page.getByTestId('scan-typed-code').fill(swapped);
    await page.getByRole('button', { name: 'Check this code' }).click();
    await expectText(page.getByTestId('scan-typed-problem'), 'does not fit the others');
    await context.close();
  });
});
