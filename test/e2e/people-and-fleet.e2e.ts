import type { Browser, Page } from 'playwright-core';
import { launchBrowser, newPage } from './browser';
import { E2E_PASSWORD } from './constants';
import { expectText, signInThroughPage as signIn } from './page-helpers';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser.close());

/** Different on every run, so a second run against the same database invites a new person. */
const RUN = Date.now().toString(36).toUpperCase();

async function signInAsAdmin(): Promise<Page> {
  const page = await newPage(browser);
  await signIn(page, 'admin@demo.speedwright.example', E2E_PASSWORD);
  await page.waitForURL('**/home');
  return page;
}

/** A select's option panel closes with an animation; a click during it lands on its backdrop. */
async function selectPanelClosed(page: Page): Promise<void> {
  await page.getByRole('listbox').waitFor({ state: 'detached' });
  await page.locator('.cdk-overlay-transparent-backdrop').waitFor({ state: 'detached' });
}

async function openFromNavigation(page: Page, label: string, path: string): Promise<void> {
  await page.getByTestId('nav-list').getByRole('link', { name: label }).click();
  await page.waitForURL(`**${path}`);
}

describe('people and fleet in Chromium', () => {
  it('an admin invites a person, who follows the mailed link, chooses a password and signs in', async () => {
    const email = `invitee-${RUN.toLowerCase()}@demo.speedwright.example`;
    const name = `Lee Quarry ${RUN}`;
    const admin = await signInAsAdmin();

    await openFromNavigation(admin, 'People', '/people');
    await admin.getByRole('button', { name: 'Invite a person' }).click();
    const dialog = admin.getByRole('dialog');
    await dialog.getByLabel('E-mail').fill(email);
    await dialog.getByLabel('Name').fill(name);
    await dialog.getByRole('combobox', { name: 'Role' }).click();
    await admin.getByRole('option', { name: 'Pilot' }).click();
    await selectPanelClosed(admin);
    await dialog.getByRole('button', { name: 'Send invitation' }).click();
    // Inviting writes the person and hands the mail to the SMTP server before it answers; on a
    // busy 2-core CI machine that can take longer than the helper's default 10 s.
    await expectText(admin.locator('simple-snack-bar'), `An invitation is on its way to ${email}.`, 30_000);
    const row = admin.getByRole('row').filter({ hasText: email });
    await expectText(row, 'Invited, no password yet', 30_000);

    // The mail reaches the fake mail server a moment after the answer; look until it is listed.
    await openFromNavigation(admin, 'Mailbox', '/mailbox');
    const mail = admin.getByTestId('mail').filter({ hasText: `To ${email}` });
    const deadline = Date.now() + 10_000;
    while ((await mail.count()) === 0 && Date.now() < deadline) {
      await admin.getByRole('button', { name: 'Check for new mail' }).click();
      await admin.waitForTimeout(300);
    }
    await expectText(mail.getByRole('heading'), 'You are invited to Kestrel Fen Aviation (demo) on Speedwright');
    const href = await mail.getByRole('link').first().getAttribute('href');
    const link = new URL(href!);
    expect(link.pathname).toBe('/invitation');
    expect(link.hash).toMatch(/^#token=[A-Za-z0-9_-]{43}$/);

    // The invitee, on a device of their own.
    const invitee = await newPage(browser);
    await invitee.goto(`${link.pathname}${link.hash}`);
    await expectText(invitee.getByRole('heading', { level: 1 }), 'Welcome to Speedwright');
    const password = `harbour lantern gravel ${RUN}`;
    await invitee.getByLabel('New password', { exact: true }).fill(password);
    await invitee.getByLabel('New password again').fill('not the same one at all');
    await invitee.getByRole('button', { name: 'Set password' }).click();
    await expectText(invitee.locator('mat-error'), 'The two passwords are not the same.');
    await invitee.getByLabel('New password again').fill(password);
    await invitee.getByRole('button', { name: 'Set password' }).click();
    await expectText(invitee.getByTestId('password-set'), `Sign in with ${email} and your new password.`);

    await invitee.getByRole('link', { name: 'Go to sign-in' }).click();
    await invitee.waitForURL('**/sign-in');
    await invitee.getByLabel('E-mail').fill(email);
    await invitee.getByLabel('Password', { exact: true }).fill(password);
    await invitee.getByRole('button', { name: 'Sign in' }).click();
    await invitee.waitForURL('**/home');
    await expectText(invitee.getByTestId('signed-in-person'), name);
    await expectText(invitee.locator('main'), email);

    // The same link does not work twice.
    const again = await newPage(browser);
    await again.goto(`${link.pathname}${link.hash}`);
    await again.getByLabel('New password', { exact: true }).fill(password);
    await again.getByLabel('New password again').fill(password);
    await again.getByRole('button', { name: 'Set password' }).click();
    await expectText(again.getByTestId('link-problem'), 'This invitation has already been used.');

    // Back on the admin's list, the person is active now.
    await openFromNavigation(admin, 'People', '/people');
    await expectText(admin.getByRole('row').filter({ hasText: email }), 'Active');

    await Promise.all([admin.context().close(), invitee.context().close(), again.context().close()]);
  });

  it('an admin adds an airframe, which every role then sees in the fleet', async () => {
    const registration = `ZZ-${RUN.slice(-5)}`;
    const admin = await signInAsAdmin();
    await openFromNavigation(admin, 'Fleet', '/fleet');
    await admin.getByRole('button', { name: 'Add airframe' }).click();
    const dialog = admin.getByRole('dialog');

    // A registration that is not one is refused in place.
    await dialog.getByLabel('Registration').fill('ZZKFA');
    await dialog.getByLabel('Serial number').fill(`E2E-${RUN}`);
    await dialog.getByRole('combobox', { name: 'Aircraft type' }).click();
    await admin.getByRole('option').first().click();
    await selectPanelClosed(admin);
    await dialog.getByRole('button', { name: 'Add airframe' }).click();
    await expectText(dialog.locator('mat-error'), 'A registration looks like ZZ-KFA');

    await dialog.getByLabel('Registration').fill(registration.toLowerCase());
    await dialog.getByRole('button', { name: 'Add airframe' }).click();
    // As for the invitation: the answer can take longer than the helper's 10 s on a busy machine.
    await expectText(admin.locator('simple-snack-bar'), `${registration} is now in your fleet.`, 30_000);
    // The first dialog must be gone (its closing animation too) before the next one is filled.
    await dialog.waitFor({ state: 'detached' });
    await admin.getByLabel('Filter airframes').fill(registration);
    await expectText(admin.getByRole('row').filter({ hasText: registration }), `E2E-${RUN}`);

    // The same registration again: the server's sentence appears under the registration field.
    await admin.getByRole('button', { name: 'Add airframe' }).click();
    await dialog.getByLabel('Serial number').fill(`E2E-${RUN}-2`);
    await dialog.getByRole('combobox', { name: 'Aircraft type' }).click();
    await admin.getByRole('option').first().click();
    await selectPanelClosed(admin);
    // The registration last, then out of the field: the form holds it and finds nothing wrong
    // before the server is asked (a failure here names the value the field really had).
    await dialog.getByLabel('Registration').fill(registration);
    await dialog.getByLabel('Registration').press('Tab');
    expect(await dialog.getByLabel('Registration').inputValue()).toBe(registration);
    expect(await dialog.locator('mat-error').count()).toBe(0);
    await dialog.getByRole('button', { name: 'Add airframe' }).click();
    await expectText(dialog.locator('mat-error'), `${registration} is already in your fleet.`);
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await admin.context().close();

    const pilot = await newPage(browser);
    await signIn(pilot, 'pilot@demo.speedwright.example', E2E_PASSWORD, '/fleet');
    await pilot.waitForURL('**/fleet');
    await pilot.getByLabel('Filter airframes').fill(registration);
    await expectText(pilot.getByRole('row').filter({ hasText: registration }), 'Active');
    expect(await pilot.getByRole('button', { name: 'Add airframe' }).count()).toBe(0);
    await pilot.context().close();
  });
});
