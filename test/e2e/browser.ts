import { chromium, type Browser, type Page } from 'playwright-core';

/** Debian's Chromium; the tests never download a browser. */
export const CHROMIUM_PATH = process.env['CHROMIUM_PATH'] ?? '/usr/bin/chromium';

const FLAGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export function launchBrowser(extraArgs: string[] = []): Promise<Browser> {
  return chromium.launch({ executablePath: CHROMIUM_PATH, args: [...FLAGS, ...extraArgs] });
}

/** The e2e server's base URL, written by the e2e global setup. */
export function baseUrl(): string {
  const url = process.env['E2E_BASE_URL'];
  if (!url) throw new Error('E2E_BASE_URL is not set: run the e2e tests through jest (npm test).');
  return url;
}

export async function newPage(browser: Browser, viewport = { width: 1024, height: 768 }): Promise<Page> {
  const context = await browser.newContext({ baseURL: baseUrl(), viewport });
  return context.newPage();
}
