import type { Locator, Page } from 'playwright-core';

/** Signs in through the sign-in page, starting from wherever `path` leads a signed-out visitor. */
export async function signInThroughPage(page: Page, email: string, password: string, path = '/'): Promise<void> {
  await page.goto(path);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

/** Waits (up to `timeoutMs`) until the first match of `locator` shows `text`; fails with what it saw. */
export async function expectText(locator: Locator, text: string, timeoutMs = 10_000): Promise<void> {
  await locator.first().waitFor({ timeout: timeoutMs });
  const deadline = Date.now() + timeoutMs;
  let seen = '';
  while (Date.now() < deadline) {
    seen = await locator.first().innerText();
    if (seen.includes(text)) return;
    await new Promise((done) => setTimeout(done, 100));
  }
  expect(seen).toContain(text);
}

/** On the card page: chooses the airframe once the choice is enabled (airframes read), and waits for its card. */
export async function chooseAirframe(page: Page, registration: string): Promise<void> {
  await page.locator('[data-testid="airframe-select"][aria-disabled="false"]').waitFor();
  await page.getByTestId('airframe-select').click();
  await page.getByRole('option', { name: new RegExp(registration) }).click();
  await page.getByTestId('speed-card').waitFor();
}
