import { request, type APIRequestContext, type Browser, type Page } from 'playwright-core';
import { loginResponseSchema } from '@shared/api/auth';
import { revisionResponseSchema, speedBookListSchema } from '@shared/api/revisions';
import { cardIssuePageSchema } from '@shared/card/card-api';
import { baseUrl, launchBrowser } from './browser';
import { E2E_PASSWORD } from './constants';
import { chooseAirframe, expectText, signInThroughPage as signIn } from './page-helpers';

/**
 * Offline on the ramp, in Chromium against the production build with its service worker: a
 * pilot signs in and the device syncs; with the network off the app reloads from the service
 * worker and the device store, a card is built and issued and waits on the device; back
 * online the entry reaches the operator's card log. An approver then publishes a new revision
 * of that book, and after the pilot's next sync the device names the card as resting on a
 * superseded revision. Signing out removes the operator's data from the device.
 *
 * The twin turboprop (ZZ-KFT, Marshlight T2 speed book) is used so that the revision workflow
 * test, which publishes the trainer's book, cannot interfere.
 */
const REGISTRATION = 'ZZ-KFT';
const BOOK = 'Marshlight T2 speed book';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());

/** A signed-in API session of its own (cookie jar and CSRF token), as a second person at another desk. */
async function apiSession(role: string): Promise<{ api: APIRequestContext; token: string }> {
  const api = await request.newContext({ baseURL: baseUrl() });
  const csrf = async () => ((await (await api.get('/api/auth/csrf')).json()) as { token: string }).token;
  const login = await api.post('/api/auth/login', { headers: { 'x-csrf-token': await csrf() }, data: { email: `${role}@demo.speedwright.example`, password: E2E_PASSWORD } });
  expect(login.status()).toBe(200);
  loginResponseSchema.parse(await login.json());
  return { api, token: await csrf() };
}

/** Waits until the service worker controls the page and has this version's files cached. */
async function waitForServiceWorker(page: Page): Promise<void> {
  await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
  if (!(await page.evaluate(() => navigator.serviceWorker.controller !== null))) await page.reload();
  const deadline = Date.now() + 60_000;
  let state = '';
  while (Date.now() < deadline) {
    state = await page.evaluate(() => fetch('/ngsw/state').then((r) => r.text()));
    if (/Driver state: NORMAL/.test(state) && /Latest manifest hash: [0-9a-f]+/.test(state)) return;
    await page.waitForTimeout(250);
  }
  throw new Error(`The service worker did not get ready:\n${state}`);
}

async function waitForSync(page: Page): Promise<void> {
  await page.locator('[data-testid="sync-status"][data-phase="succeeded"]').first().waitFor({ timeout: 30_000 });
}

async function issuedEntryIn(page: Page): Promise<string> {
  const id = await page.locator('[data-testid="device-card-log"] li').first().getAttribute('data-entry-id');
  if (!id) throw new Error('No entry in the device card log.');
  return id;
}

describe('offline on the ramp in Chromium', () => {
  it('syncs, works offline after a reload, reports the card when back online, and notices the supersession', async () => {
    const context = await browser.newContext({ baseURL: baseUrl(), viewport: { width: 1024, height: 768 } });
    const page = await context.newPage();
    await signIn(page, 'pilot@demo.speedwright.example', E2E_PASSWORD, '/home');
    await page.waitForURL('**/home');
    await waitForSync(page);
    await expectText(page.getByTestId('data-as-of'), 'Data as of');
    await waitForServiceWorker(page);
    await waitForSync(page);

    // No network: the app reloads from the service worker, the person from the device.
    await context.setOffline(true);
    await page.reload();
    await expectText(page.getByTestId('connection-status'), 'Offline');
    await expectText(page.getByTestId('signed-in-person'), 'Pilot');
    await expectText(page.getByTestId('data-as-of'), 'Data as of');

    // A card from the device store, issued while offline: it waits on the device.
    await page.getByRole('link', { name: /Speed card/ }).first().click();
    await page.waitForURL('**/cards');
    await chooseAirframe(page, REGISTRATION);
    await expectText(page.getByTestId('card-data-as-of'), 'Data as of');
    await expectText(page.getByTestId('card-caution'), "Planning aid. The approved flight manual and the operator's procedures govern.");
    const digest = (await page.getByTestId('speed-card').getAttribute('data-digest'))!;
    await page.getByTestId('issue-card').click();
    await expectText(page.getByTestId('issue-status'), 'kept on this device');
    const entryId = await issuedEntryIn(page);
    expect(await page.locator(`[data-testid="device-card-log"] li[data-entry-id="${entryId}"]`).getAttribute('data-state')).toBe('waiting');

    // Back online: the sync that follows sends the entry, and the server's card log has it.
    await context.setOffline(false);
    await expectText(page.locator(`[data-testid="device-card-log"] li[data-entry-id="${entryId}"]`), 'recorded by the server', 30_000);
    const log = cardIssuePageSchema.parse(await (await page.request.get('/api/card-issues?limit=50')).json());
    expect(log.entries.find((e) => e.id === entryId)).toMatchObject({ digest, airframe: { registration: REGISTRATION } });

    // An engineer drafts and an approver publishes a new revision of the book, through the API.
    const engineer = await apiSession('engineer');
    const approver = await apiSession('approver');
    const books = speedBookListSchema.parse(await (await engineer.api.get('/api/speed-books')).json()).speedBooks;
    const book = books.find((b) => b.title === BOOK)!;
    const current = revisionResponseSchema.parse(await (await engineer.api.get(`/api/revisions/${book.currentRevision!.id}`)).json()).revision;
    const content = { ...current.content, notes: `${String(current.content['notes'] ?? '')} Revised in the offline e2e test.` };
    const draft = await engineer.api.post(`/api/speed-books/${book.id}/revisions`, { headers: { 'x-csrf-token': engineer.token }, data: { content, changeSummary: 'Notes revised (e2e).' } });
    expect(draft.status()).toBe(201);
    const draftId = ((await draft.json()) as { revision: { id: number } }).revision.id;
    expect((await engineer.api.post(`/api/revisions/${draftId}/submit`, { headers: { 'x-csrf-token': engineer.token } })).status()).toBe(200);
    expect((await approver.api.post(`/api/revisions/${draftId}/approve`, { headers: { 'x-csrf-token': approver.token } })).status()).toBe(200);
    await engineer.api.dispose();
    await approver.api.dispose();

    // The pilot syncs on demand; the home page names the card as resting on a superseded revision.
    await page.getByRole('link', { name: 'Speedwright' }).click();
    await page.waitForURL('**/home');
    await page.getByTestId('sync-now').click();
    const notice = page.locator(`[data-testid="revision-notice"][data-entry-id="${entryId}"]`);
    await notice.waitFor({ timeout: 30_000 });
    expect(await notice.getAttribute('data-status')).toBe('superseded');
    await expectText(notice, `rests on revision ${current.number} of ${BOOK}, superseded`);

    // Signing out removes the operator's data from the device.
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL('**/sign-in**');
    const left = await page.evaluate(
      () =>
        new Promise<Record<string, number>>((resolve, reject) => {
          const open = indexedDB.open('speedwright');
          open.onerror = () => reject(open.error);
          open.onsuccess = () => {
            const db = open.result;
            const names = ['revisions', 'airframes', 'aircraftTypes', 'syncState', 'sessions', 'cardLog'];
            const tx = db.transaction(names, 'readonly');
            const counts: Record<string, number> = {};
            for (const name of names) {
              const req = tx.objectStore(name).count();
              req.onsuccess = () => (counts[name] = req.result);
            }
            tx.oncomplete = () => resolve(counts);
          };
        }),
    );
    expect(left).toEqual({ revisions: 0, airframes: 0, aircraftTypes: 0, syncState: 0, sessions: 0, cardLog: 0 });
    await context.close();
  });
});
