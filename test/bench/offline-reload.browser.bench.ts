/**
 * Benchmark of the offline reload (issue 6). Run: `npx ng build` once, then
 * `npx tsx test/bench/offline-reload.browser.bench.ts`.
 *
 * Starts the real server with the production build against a database of its own on the test
 * instance (`speedwright_bench_offline`, demo seed), signs the demo pilot in through the page in
 * headless Chromium, lets the service worker install and the device sync, takes the browser
 * context offline, and then reloads the card page 11 times. Each time is measured from the
 * reload's start to an interactive card form: the airframe choice enabled, which it is only once
 * the airframes have been read from the device store. The first reload is dropped; target: the
 * median of the other 10 under 1.5 s.
 *
 * Times come from the page's clock (performance.timeOrigin of the new document to the moment
 * the choice is enabled, polled every animation frame), so the test driver's own latency is not
 * counted. The load average is printed beside the figures.
 */
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { loadavg } from 'node:os';
import { projectRoot } from '../../db/instance';
import { stopLocalInstance } from '../../db/local';
import { launchBrowser } from '../e2e/browser';
import { startAppServer } from '../support/app-server';

const TARGET_MS = 1500;
const RELOADS = 11;
const PASSWORD = 'bench-password-not-for-use';
const READY = '[data-testid="airframe-select"][aria-disabled="false"]';

const median = (values: number[]): number => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)]!;

async function main(): Promise<void> {
  if (!existsSync(join(projectRoot, 'dist/app/browser/index.html'))) {
    console.error('Build the app first: npx ng build');
    process.exit(1);
  }
  const server = await startAppServer({ database: 'speedwright_bench_offline', password: PASSWORD, name: 'bench-offline' });
  const browser = await launchBrowser();
  let missed = true;
  try {
    const context = await browser.newContext({ baseURL: server.baseUrl, viewport: { width: 1024, height: 768 } });
    const page = await context.newPage();
    await page.goto('/cards');
    await page.getByLabel('E-mail').fill('pilot@demo.speedwright.example');
    await page.getByLabel('Password', { exact: true }).fill(PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.locator(READY).waitFor({ timeout: 60_000 });
    // The service worker must control the page and hold the whole app before going offline.
    await page.evaluate(`(async () => {
      await navigator.serviceWorker.ready;
      const deadline = Date.now() + 60000;
      while (Date.now() < deadline) {
        const state = await (await fetch('/ngsw/state')).text();
        if (navigator.serviceWorker.controller && /Driver state: NORMAL/.test(state) && !/Latest manifest hash: none/.test(state)) return;
        await new Promise((done) => setTimeout(done, 250));
      }
      throw new Error('The service worker did not take the page in 60 s.');
    })()`);
    // One online reload so the controlled page has cached every lazy chunk it uses.
    await page.reload();
    await page.locator(READY).waitFor({ timeout: 30_000 });
    await context.setOffline(true);

    const times: number[] = [];
    for (let i = 0; i < RELOADS; i++) {
      await page.reload({ waitUntil: 'commit' });
      // A string, not a function: tsx would wrap a function's inner names in a helper the page lacks.
      const ms = await page.evaluate<number>(`new Promise((resolve, reject) => {
        const started = performance.now();
        const tick = () => {
          if (document.querySelector(${JSON.stringify(READY)})) resolve(performance.now());
          else if (performance.now() - started > 30000) reject(new Error('The card form did not become interactive offline in 30 s.'));
          else requestAnimationFrame(tick);
        };
        tick();
      })`);
      times.push(ms);
    }
    times.shift();
    const result = median(times);
    console.log(`load average ${loadavg().map((v) => v.toFixed(2)).join(' ')}`);
    console.log(`offline reload to an interactive card form: median ${result.toFixed(0)} ms of ${times.length} (min ${Math.min(...times).toFixed(0)}, max ${Math.max(...times).toFixed(0)}; target < ${TARGET_MS} ms)`);
    missed = result >= TARGET_MS;
  } finally {
    await browser.close();
    await server.stop();
    if (server.startedDb) await stopLocalInstance('test');
  }
  process.exit(missed ? 1 : 0);
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
