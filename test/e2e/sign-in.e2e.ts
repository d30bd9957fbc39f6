import type { Browser, Page } from 'playwright-core';
import { ROLES, type Role } from '@shared/auth/roles';
import { launchBrowser, newPage } from './browser';
import { E2E_PASSWORD } from './constants';
import { expectText, signInThroughPage as signIn } from './page-helpers';

/** What each role's side navigation must list, in order (product.md, "Roles"). */
const EXPECTED_NAVIGATION: Record<Role, string[]> = {
  pilot: ['Home', 'Speed card', 'Check a card', 'Speed books', 'Fleet'],
  engineer: ['Home', 'Speed card', 'Check a card', 'Speed books', 'Drafts', 'Card log', 'Fleet'],
  approver: ['Home', 'Speed card', 'Check a card', 'Speed books', 'Drafts', 'Review', 'Card log', 'Fleet', 'Audit trail'],
  admin: ['Home', 'Check a card', 'Speed books', 'Card log', 'Fleet', 'People', 'Operator settings', 'Audit trail', 'Mailbox'],
  inspector: ['Home', 'Check a card', 'Speed books', 'Card log', 'Fleet', 'Audit trail'],
};

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser.close());

async function navigationLabels(page: Page): Promise<string[]> {
  const list = page.getByTestId('nav-list');
  await list.waitFor();
  return list.getByRole('link').allInnerTexts();
}

describe('sign-in in Chromium', () => {
  it.each(ROLES)('signs in the %s, who sees their own navigation, operator and the caution', async (role) => {
    const page = await newPage(browser);
    await signIn(page, `${role}@demo.speedwright.example`, E2E_PASSWORD);
    await page.waitForURL('**/home');
    await expectText(page.getByTestId('operator-name'), 'Kestrel Fen Aviation (demo)');
    const labels = await navigationLabels(page);
    expect(labels).toEqual(EXPECTED_NAVIGATION[role].map((label) => expect.stringContaining(label)));
    expect(labels).toHaveLength(EXPECTED_NAVIGATION[role].length);
    await expectText(page.getByTestId('safety-caution'), 'The approved flight manual and the operator\'s procedures govern.');
    await expectText(page.locator('main'), `${role}@demo.speedwright.example`);
    await page.context().close();
  });

  it('shows a clear sentence for a wrong password and stays on the sign-in page', async () => {
    const page = await newPage(browser);
    await signIn(page, 'pilot@demo.speedwright.example', 'not-the-password');
    await expectText(page.getByTestId('sign-in-error'), 'The e-mail or password is not right.');
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await page.context().close();
  });

  it('sends a signed-out visitor of a page to sign-in and back there afterwards', async () => {
    const page = await newPage(browser);
    await signIn(page, 'admin@demo.speedwright.example', E2E_PASSWORD, '/people');
    await page.waitForURL('**/people');
    await expectText(page.locator('main'), 'pilot@demo.speedwright.example');
    await page.context().close();
  });

  it('signs out and forgets the session', async () => {
    const page = await newPage(browser);
    await signIn(page, 'engineer@demo.speedwright.example', E2E_PASSWORD);
    await page.waitForURL('**/home');
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByLabel('E-mail').waitFor();
    const me = await page.request.get('/api/auth/me');
    expect(me.status()).toBe(401);
    await page.context().close();
  });
});
