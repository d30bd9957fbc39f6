import { existsSync, readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';

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
  if (!existsSync(indexFile)) return { signIn: [], check: [] };
  const entries = [...readFileSync(indexFile, 'utf8').matchAll(/<script[^>]*\ssrc="([\w.-]+\.js)"/g)].map((match) => match[1]!);
  const initial = staticClosure(distDir, entries);
  const chunks = readdirSync(distDir).filter((name) => /^chunk-[\w-]+\.js$/.test(name) && !initial.has(name));
  const pageModules = (selector: string): string[] => {
    const declaration = `selectors:[[\`${selector}\`]]`;
    const declarationQuoted = `selectors:[["${selector}"]]`;
    const page = chunks.find((name) => {
      const code = readFileSync(join(distDir, name), 'utf8');
      return code.includes(declaration) || code.includes(declarationQuoted);
    });
    if (!page) return [];
    const closure = [...staticClosure(distDir, [page])].filter((name) => !initial.has(name));
    // The page's own chunk first: its download starts the render path.
    return [page, ...closure.filter((name) => name !== page).sort()].slice(0, MAX_MODULES_PER_PAGE).map((name) => `/${name}`);
  };
  return { signIn: pageModules('sw-sign-in-page'), check: pageModules('sw-check-page') };
}

/** The modules to preload with index.html for a request path (none for other pages). */
export function modulesForPath(modules: FirstScreenModules, path: string): readonly string[] {
  if (path === '/sign-in') return modules.signIn;
  if (path.startsWith('/check/')) return modules.check;
  return [];
}

/** `Link` header entries for modules (same origin: module scripts are fetched in CORS mode, with credentials). */
export function modulePreloadLinks(paths: readonly string[]): string[] {
  return paths.map((path) => `<${path}>; rel=modulepreload`);
}
