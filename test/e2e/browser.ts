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

export interface LaunchOptions {
  extraArgs?: string[];
  /**
   * A Y4M video (YUV4MPEG2) that Chromium plays as the camera, with camera permission granted
   * without a prompt (Chromium's fake capture device): for scanning tests.
   */
  fakeCameraFile?: string;
}

export function launchBrowser(options: string[] | LaunchOptions = []): Promise<Browser> {
  const { extraArgs = [], fakeCameraFile } = Array.isArray(options) ? { extraArgs: options } : options;
  const camera = fakeCameraFile
    ? ['--use-fake-device-for-media-stream', '--use-fake-ui-for-media-stream', `--use-file-for-fake-video-capture=${fakeCameraFile}`]
    : [];
  return chromium.launch({ executablePath: CHROMIUM_PATH, args: [...FLAGS, ...camera, ...extraArgs] });
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
