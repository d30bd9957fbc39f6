import { existsSync, readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { FIGURES_DIFFER } from '@shared/card-check/figures-check';

/**
 * The code of the two pages a phone most often opens first, the sign-in page and a printed
 * card's check page, for a `Link: rel=modulepreload` header with index.html (HTML Living
 * Standard, "Link type modulepreload"; RFC 8288 for the header). Without it the browser learns
 * of a page's modules one level at a time: the entry script, then the page's chunk (requested at
 * bootstrap by `src/app/first-screen-pages.ts`), then the chunks that one imports, each level a
 * round trip on a slow phone network. With it, all of them are on their way beside the entry
 * script.
 *
 * The build gives chunks hashed names, so the server finds them once: the page's chunk is the one
 * that declares the page component's selector (Angular keeps selectors in the production build),
 * and its modules are that chunk's static import closure (`import … from "./chunk-….js"`),
 * less what the entry scripts of index.html already load.
 */
export interface FirstScreenModules {
  /** Module paths (`/chunk-….js`) for `/sign-in`. */
  readonly signIn: readonly string[];
  /** Module paths for `/check/<code>`. */
  readonly check: readonly string[];
  /**
   * Module paths of the card re-derivation the check page imports when the address carries a
   * card's figures (`?c=`, what a QR code opens): the chunk holding `figures-check` (found by its
   * sentence `FIGURES_DIFFER`, which minifying keeps) and its static imports, less the above.
   */
  readonly checkFigures: readonly string[];
}

/** A chunk's static imports: `import"./x.js"`, `import{a}from"./x.js"`, `export{a}from"./x.js"`. */
const STATIC_IMPORT = /(?:^|[;}\s])(?:import|export)\s*(?:[\w${},*\s]*?\bfrom\s*)?"\.\/([\w.-]+\.js)"/g;

/** Upper bound on the modules one page may name (the header stays a sensible size). */
const MAX_MODULES_PER_PAGE = 40;

function staticClosure(distDir: string, start: readonly string[]): Set<string> {
  const seen = new Set<string>();
  const pending = [...start];
  while (pending.length > 0 && seen.size < 1000) {
    const file = pending.pop()!;
    if (seen.has(file) || !existsSync(join(distDir, file))) continue;
    seen.add(file);
    for (const match of readFileSync(join(distDir, file), 'utf8').matchAll(STATIC_IMPORT)) pending.push(match[1]!);
  }
  return seen;
}

/** The modules of each first page in the build in `distDir` (empty lists when not found). */
export function firstScreenModules(distDir: string): FirstScreenModules {
  const indexFile = join(distDir, 'index.html');
  if (!existsSync(indexFile)) return { signIn: [], check: [], checkFigures: [] };
  const entries = [...readFileSync(indexFile, 'utf8').matchAll(/<script[^>]*\ssrc="([\w.-]+\.js)"/g)].map((match) => match[1]!);
  const initial = staticClosure(distDir, entries);
  const chunks = readdirSync(distDir).filter((name) => /^chunk-[\w-]+\.js$/.test(name) && !initial.has(name));
  const modulesOf = (holds: (code: string) => boolean, known: ReadonlySet<string>): string[] => {
    const first = chunks.find((name) => !known.has(name) && holds(readFileSync(join(distDir, name), 'utf8')));
    if (!first) return [];
    const closure = [...staticClosure(distDir, [first])].filter((name) => !known.has(name));
    // The chunk itself first: its download starts the render path.
    return [first, ...closure.filter((name) => name !== first).sort()].slice(0, MAX_MODULES_PER_PAGE);
  };
  const declares = (selector: string) => (code: string) => code.includes(`selectors:[[\`${selector}\`]]`) || code.includes(`selectors:[["${selector}"]]`);
  const signIn = modulesOf(declares('sw-sign-in-page'), initial);
  const check = modulesOf(declares('sw-check-page'), initial);
  const checkFigures = check.length > 0 ? modulesOf((code) => code.includes(FIGURES_DIFFER), new Set([...initial, ...check])) : [];
  const paths = (names: string[]) => names.map((name) => `/${name}`);
  return { signIn: paths(signIn), check: paths(check), checkFigures: paths(checkFigures) };
}

/**
 * The modules to preload with index.html for a request path (none for other pages);
 * `withFigures` when the check address carries a card's figures (`?c=`).
 */
export function modulesForPath(modules: FirstScreenModules, path: string, withFigures = false): readonly string[] {
  if (path === '/sign-in') return modules.signIn;
  if (path.startsWith('/check/')) return withFigures ? [...modules.check, ...modules.checkFigures] : modules.check;
  return [];
}

/** `Link` header entries for modules (same origin: module scripts are fetched in CORS mode, with credentials). */
export function modulePreloadLinks(paths: readonly string[]): string[] {
  return paths.map((path) => `<${path}>; rel=modulepreload`);
}
