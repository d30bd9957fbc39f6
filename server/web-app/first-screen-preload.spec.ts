import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { FIGURES_DIFFER } from '@shared/card-check/figures-check';
import { firstScreenModules, modulePreloadLinks, modulesForPath } from './first-screen-preload';

/** A small build as Angular's chunk optimizer writes one: an entry, shared and page chunks. */
function fakeBuild(files: Record<string, string>): string {
  const dir = mkdtempSync(join(tmpdir(), 'speedwright-preload-'));
  for (const [name, text] of Object.entries(files)) writeFileSync(join(dir, name), text);
  return dir;
}

describe('first-screen module preload', () => {
  let dist: string;
  afterEach(() => rmSync(dist, { recursive: true, force: true }));

  it('names each first page’s chunk and its static imports, less what the entry script loads, and the card re-derivation for a QR code', () => {
    dist = fakeBuild({
      'index.html': '<html><body><sw-root></sw-root><script src="main-AAAA1111.js" type="module"></script></body></html>',
      'main-AAAA1111.js': 'import{a}from"./chunk-Shared01.js";const p=()=>import(`./chunk-SignIn01.js`);',
      'chunk-Shared01.js': 'export const a=1;',
      'chunk-SignIn01.js': 'import{a}from"./chunk-Shared01.js";import{f}from"./chunk-Forms001.js";static ɵcmp=x({selectors:[[`sw-sign-in-page`]]});',
      'chunk-Forms001.js': 'import"./chunk-Zod00001.js";export const f=2;',
      'chunk-Zod00001.js': 'export const z=3;',
      'chunk-Check001.js': 'import{z}from"./chunk-Zod00001.js";static ɵcmp=x({selectors:[[`sw-check-page`]]});const f=()=>import(`./chunk-Figure01.js`);',
      'chunk-Figure01.js': `import{z}from"./chunk-Zod00001.js";import"./chunk-Aero0001.js";const d=\`${FIGURES_DIFFER}\`;`,
      'chunk-Aero0001.js': 'export const isa=15;',
      'chunk-Other001.js': 'import{z}from"./chunk-Zod00001.js";static ɵcmp=x({selectors:[[`sw-home-page`]]});',
    });
    const modules = firstScreenModules(dist);
    expect(modules.signIn).toEqual(['/chunk-SignIn01.js', '/chunk-Forms001.js', '/chunk-Zod00001.js']);
    expect(modules.check).toEqual(['/chunk-Check001.js', '/chunk-Zod00001.js']);
    expect(modulesForPath(modules, '/sign-in')).toEqual(modules.signIn);
    expect(modules.checkFigures).toEqual(['/chunk-Figure01.js', '/chunk-Aero0001.js']);
    // A typed code carries no figures: the re-derivation is not preloaded for it.
    expect(modulesForPath(modules, '/check/ABC-123-XYZ')).toEqual(modules.check);
    expect(modulesForPath(modules, '/check/ABC-123-XYZ', true)).toEqual([...modules.check, ...modules.checkFigures]);
    expect(modulesForPath(modules, '/home')).toEqual([]);
    expect(modulePreloadLinks(modules.check)).toEqual(['</chunk-Check001.js>; rel=modulepreload', '</chunk-Zod00001.js>; rel=modulepreload']);
  });

  it('names nothing when the build lacks the pages or index.html, and stops at import cycles', () => {
    dist = fakeBuild({
      'index.html': '<script src="main-BBBB2222.js" type="module"></script>',
      'main-BBBB2222.js': 'import"./chunk-Cycle001.js";',
      'chunk-Cycle001.js': 'import"./chunk-Cycle002.js";',
      'chunk-Cycle002.js': 'import"./chunk-Cycle001.js";',
    });
    expect(firstScreenModules(dist)).toEqual({ signIn: [], check: [], checkFigures: [] });
    expect(firstScreenModules(join(dist, 'missing'))).toEqual({ signIn: [], check: [], checkFigures: [] });
  });
});
