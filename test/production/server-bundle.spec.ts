/**
 * What the compiled server holds and needs (`tools/build-server.ts`, esbuild's metafile): no
 * development code from server/dev/, every package it requires among package.json's
 * `dependencies` (else `npm ci --omit=dev` would leave it out), and nothing in `dependencies`
 * that production never loads (development tools and the web app's packages belong in
 * `devDependencies`, so an operator's server installs only what runs there).
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { builtinModules } from 'node:module';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { projectRoot } from '../../db/instance';
import { MIGRATION_NAMES } from '../../db/migrator';
import { cardFontFiles } from '@shared/card-pdf/fonts';
import { buildServer, SERVER_ENTRY_POINTS, type ServerBuild } from '../../tools/build-server';

jest.setTimeout(120_000);

/** The package a bare import names: `@noble/hashes/sha2` → `@noble/hashes`, `zod/mini` → `zod`. */
function packageOf(specifier: string): string {
  const parts = specifier.split('/');
  return specifier.startsWith('@') ? parts.slice(0, 2).join('/') : parts[0]!;
}

const BUILTINS = new Set(builtinModules);

describe('the compiled server', () => {
  let outDir: string;
  let build: ServerBuild;
  const manifest = JSON.parse(readFileSync(join(projectRoot, 'package.json'), 'utf8')) as { dependencies: Record<string, string>; devDependencies: Record<string, string> };

  beforeAll(async () => {
    outDir = mkdtempSync(join(tmpdir(), 'speedwright-server-build-'));
    build = await buildServer(outDir);
  });
  afterAll(() => rmSync(outDir, { recursive: true, force: true }));

  it('builds every entry point', () => {
    expect(Object.keys(build.bytes).sort()).toEqual(Object.keys(SERVER_ENTRY_POINTS).sort());
    for (const bytes of Object.values(build.bytes)) expect(bytes).toBeGreaterThan(1000);
  });

  it('holds nothing of server/dev/ (the mailbox page is left out and refuses to load)', () => {
    const inputs = Object.values(build.metafile.outputs).flatMap((output) => Object.keys(output.inputs));
    expect(inputs.filter((input) => input.startsWith('server/dev/'))).toEqual([]);
    expect(inputs.filter((input) => input.startsWith('left-out:'))).toEqual(['left-out:server/dev/mailbox.routes']);
  });

  it('holds every migration in the migrate command, so that `npm run migrate` needs no sources', () => {
    const migrate = Object.values(build.metafile.outputs).find((output) => output.entryPoint === SERVER_ENTRY_POINTS['migrate']);
    const held = Object.keys(migrate!.inputs).filter((input) => /^db\/migrations\/\d{8}-\d{4}-[a-z0-9-]+\.ts$/.test(input));
    expect(held.map((input) => input.replace(/^db\/migrations\/|\.ts$/g, '')).sort()).toEqual([...MIGRATION_NAMES].sort());
  });

  it('requires only packages of `dependencies`, and every dependency is used in production', () => {
    const required = new Set<string>();
    for (const output of Object.values(build.metafile.outputs)) {
      for (const { path, external } of output.imports) {
        if (!external || path.startsWith('node:') || BUILTINS.has(path)) continue;
        required.add(packageOf(path));
      }
    }
    // Resolved at run time by name (the card PDF's fonts, server/cards/card-pdf-renderer.ts).
    for (const font of cardFontFiles()) required.add(font.fontsourcePackage);

    const dependencies = Object.keys(manifest.dependencies).sort();
    expect([...required].filter((name) => !dependencies.includes(name)).sort()).toEqual([]);
    expect(dependencies.filter((name) => !required.has(name))).toEqual([]);
    for (const devOnly of ['tsx', 'jest', 'esbuild', 'typescript', 'smtp-server', 'mailparser', '@angular/core']) {
      expect({ devOnly, inDependencies: devOnly in manifest.dependencies }).toEqual({ devOnly, inDependencies: false });
    }
  });
});
