/**
 * A first visit on a phone (issue 17), in Chromium at a phone's viewport: the sign-in page and a
 * printed card's check page pass axe-core's WCAG 2.1 A and AA rules with no violation; every
 * icon of the app's main screens is drawn as its glyph from the subset icon font (a ligature
 * the font lacks would show its name's letters, many times wider than one icon); index.html
 * preloads the first screen's fonts and the first page's modules, and the API answers the check
 * page waits for, which the page then takes (one request each); and the service worker's manifest prefetches every
 * script and every WOFF2 font of the build. Sizes and scores are the benchmark's business
 * (test/bench/first-visit.browser.bench.ts).
 */
import { readFileSync } from 'node:fs';
import type { Browser, Page } from 'playwright-core';
import { openLocalDatabase } from '../../db/local';
import { issueDemoCard } from '../support/issue-demo-card';
import { baseUrl, launchBrowser } from './browser';
import { E2E_PASSWORD } from './constants';
import { signInThroughPage } from './page-helpers';

const PHONE = { width: 390, height: 844 };
const AXE_SOURCE = readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');

interface AxeViolation {
  id: string;
  help: string;
  nodes: Array<{ target: string[] }>;
}

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser.close());

async function phonePage(): Promise<Page> {
  // bypassCSP: the app's CSP forbids inline scripts, axe is injected as one.
  const context = await browser.newContext({ baseURL: baseUrl(), viewport: PHONE, isMobile: true, hasTouch: true, bypassCSP: true });
  return context.newPage();
}

/** axe-core's WCAG 2.0/2.1 level A and AA rules (the tags of axe-core 4.x). */
async function axeViolations(page: Page): Promise<string[]> {
  await page.addScriptTag({ content: AXE_SOURCE });
  const violations = await page.evaluate<AxeViolation[]>(
    `axe.run(document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] } }).then((r) => r.violations)`,
  );
  return violations.map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(' ')).join(', ')})`);
}

/** The icons on the page that are not drawn as one glyph: wider than 1.5 times their font size. */
async function iconsShownAsText(page: Page): Promise<string[]> {
  await page.evaluate('document.fonts.ready.then(() => undefined)');
  return page.evaluate<string[]>(`[...document.querySelectorAll('mat-icon')]
    .filter((icon) => icon.getBoundingClientRect().width > 0 && icon.textContent.trim() !== '')
    .filter((icon) => {
      // The drawn text's own width (padding, as Material gives prefix icons, left out).
      const range = document.createRange();
      range.selectNodeContents(icon);
      return range.getBoundingClientRect().width > 1.5 * parseFloat(getComputedStyle(icon).fontSize);
    })
    .map((icon) => icon.textContent.trim())`);
}

describe('a first visit on a phone', () => {
  let checkUrl = '';
  beforeAll(async () => {
    const { url } = await openLocalDatabase('test', 'speedwright_e2e_test');
    checkUrl = (await issueDemoCard(url, baseUrl())).url;
  });

  /**
   * The page's modules named in index.html's `Link: rel=modulepreload` header: each one is a
   * chunk, and the same page opened without that header (the header removed on the way) still
   * loads every one of them, so nothing is preloaded in vain.
   */
  async function expectPageModulesPreloaded(path: string, links: string, ready: (page: Page) => Promise<void>): Promise<void> {
    const modules = [...links.matchAll(/<([^>]+)>; rel=modulepreload/g)].map((match) => match[1]!);
    expect(modules.length).toBeGreaterThan(0);
    for (const module of modules) expect(module).toMatch(/^\/chunk-[\w-]+\.js$/);
    const page = await phonePage();
    await page.route(
      (url) => url.pathname === new URL(path, baseUrl()).pathname,
      async (route) => {
        const response = await route.fetch();
        const headers = { ...response.headers() };
        delete headers['link'];
        await route.fulfill({ response, headers });
      },
    );
    await page.goto(path);
    await ready(page);
    const loaded = await page.evaluate<string[]>(`performance.getEntriesByType('resource').map((entry) => new URL(entry.name).pathname)`);
    expect(modules.filter((module) => !loaded.includes(module))).toEqual([]);
    await page.context().close();
  }

  it('sign-in: no WCAG 2.1 AA violation, icons drawn, the first screen’s fonts and modules preloaded', async () => {
    const page = await phonePage();
    const response = await page.goto('/sign-in');
    await page.getByRole('button', { name: 'Sign in' }).waitFor();
    expect(await axeViolations(page)).toEqual([]);
    expect(await iconsShownAsText(page)).toEqual([]);
    expect(await page.locator('mat-icon').count()).toBeGreaterThan(0);

    const links = (await response!.headerValue('link')) ?? '';
    const preloaded = [...links.matchAll(/<([^>]+)>; rel=preload; as=font/g)].map((match) => match[1]!);
    expect(preloaded).toEqual([
      expect.stringMatching(/^\/media\/roboto-latin-400-normal-\w+\.woff2$/),
      expect.stringMatching(/^\/media\/roboto-latin-500-normal-\w+\.woff2$/),
      expect.stringMatching(/^\/media\/material-symbols-subset-\w+\.woff2$/),
    ]);
    for (const path of preloaded) expect((await page.request.get(path)).status()).toBe(200);
    await page.context().close();
    await expectPageModulesPreloaded('/sign-in', links, (again) => again.getByRole('button', { name: 'Sign in' }).waitFor());
  });

  it('asks the server once for each answer the first screen waits for: the preloaded ones are taken by the page', async () => {
    const page = await phonePage();
    const asked: string[] = [];
    const askedByTheApp: string[] = [];
    page.on('request', (request) => {
      const { pathname } = new URL(request.url());
      if (!pathname.startsWith('/api/')) return;
      asked.push(pathname);
      // The app's own requests (HttpClient: XHR) reach the network only when no preload served them.
      if (request.resourceType() === 'xhr' || request.resourceType() === 'fetch') askedByTheApp.push(pathname);
    });
    const response = await page.goto(checkUrl);
    await page.getByTestId('check-figures-result').waitFor({ timeout: 20_000 });
    expect(await page.getByTestId('check-figures-result').getAttribute('data-outcome')).toBe('matches');
    const code = new URL(checkUrl).pathname.split('/')[2]!;
    const fetches = [...((await response!.headerValue('link')) ?? '').matchAll(/<([^>]+)>; rel=preload; as=fetch; crossorigin/g)].map((match) => match[1]!);
    expect(fetches).toEqual(['/api/auth/me', `/api/verify/${code}`, `/api/verify/${code}/source`]);
    // Each once: the preload, never the page's own request beside it.
    expect(asked.sort()).toEqual([...fetches].sort());
    expect(askedByTheApp).toEqual([]);
    await page.context().close();
  });

  it('check page of an issued card: no WCAG 2.1 AA violation, icons drawn, the card re-derived, its modules preloaded', async () => {
    const page = await phonePage();
    const response = await page.goto(checkUrl);
    await page.getByTestId('check-status-title').waitFor({ timeout: 20_000 });
    // The card view is drawn once scrolled into view (deferred: it is below the fold on a phone).
    await page.getByTestId('check-card-placeholder').scrollIntoViewIfNeeded();
    await page.getByTestId('speed-card').waitFor({ timeout: 20_000 });
    expect(await page.getByTestId('check-figures-result').getAttribute('data-outcome')).toBe('matches');
    expect(await axeViolations(page)).toEqual([]);
    expect(await iconsShownAsText(page)).toEqual([]);
    const links = (await response!.headerValue('link')) ?? '';
    await page.context().close();
    await expectPageModulesPreloaded(checkUrl, links, async (again) => {
      await again.getByTestId('check-figures-result').waitFor({ timeout: 20_000 });
    });
  });

  it('draws every icon of the main screens as a glyph, signed in as admin and as engineer', async () => {
    for (const [email, paths] of [
      ['admin@demo.speedwright.example', ['/home', '/people', '/fleet', '/operator-settings', '/audit', '/scan']],
      ['engineer@demo.speedwright.example', ['/home', '/cards', '/speed-books', '/drafts', '/card-log']],
    ] as const) {
      const page = await phonePage();
      await signInThroughPage(page, email, E2E_PASSWORD, '/sign-in');
      await page.waitForURL('**/home');
      for (const path of paths) {
        await page.goto(path);
        await page.locator('main h1').first().waitFor();
        await page.waitForLoadState('networkidle');
        expect({ path, text: await iconsShownAsText(page) }).toEqual({ path, text: [] });
      }
      // The navigation (opened from the menu button on a phone) and its icons.
      await page.getByRole('button', { name: 'Open navigation' }).click();
      await page.getByTestId('nav-list').waitFor();
      expect(await iconsShownAsText(page)).toEqual([]);
      await page.context().close();
    }
  });

  it('has the service worker prefetch every script and every WOFF2 font of the build', async () => {
    const page = await phonePage();
    const manifest = (await (await page.request.get('/ngsw.json')).json()) as { assetGroups: Array<{ installMode: string; urls: string[] }>; hashTable: Record<string, string> };
    const prefetched = new Set(manifest.assetGroups.filter((group) => group.installMode === 'prefetch').flatMap((group) => group.urls));
    const built = Object.keys(manifest.hashTable).filter((url) => /\.js$|\.woff2$/.test(url) && url !== '/ngsw-worker.js' && url !== '/safety-worker.js' && url !== '/worker-basic.min.js');
    expect(built.filter((url) => /material-symbols-subset/.test(url))).toHaveLength(1);
    expect(built.filter((url) => !prefetched.has(url))).toEqual([]);
    await page.context().close();
  });
});
