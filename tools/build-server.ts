/**
 * `npm run build:server` (and the second half of `npm run build`): compiles the server and its
 * command-line entry points into `dist/server/`, one CommonJS file each, run with plain `node`.
 *
 * esbuild bundles our own TypeScript (server/, db/ with its migrations, shared/) and leaves
 * every npm package external (`packages: 'external'`), so the copy on a server needs only
 * `npm ci --omit=dev`. The development pieces in `server/dev/` never enter the bundle: an
 * import of them fails the build, except the mailbox page that `server/app.ts` loads on demand
 * when MAILBOX_DIR is set, which is replaced by a module that refuses to load (and the
 * compiled server's configuration check refuses MAILBOX_DIR before that could happen).
 * `dist/server/meta.json` is esbuild's metafile: which sources each output holds and which
 * packages it requires (`test/production/server-bundle.spec.ts` reads it).
 *
 * Another command that must run in production adds one line to SERVER_ENTRY_POINTS.
 */
import { mkdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import { build, type Metafile, type Plugin } from 'esbuild';

const root = join(__dirname, '..');

/** Output name (`dist/server/<name>.js`) → source, relative to the project root. */
export const SERVER_ENTRY_POINTS: Readonly<Record<string, string>> = {
  /** `npm run serve`: the supervisor and its server processes. */
  main: 'server/main.ts',
  /** `npm run migrate`: the migrations of this build against DATABASE_URL. */
  migrate: 'db/migrate.ts',
  /** `npm run operator:create` / `operator:list`: setting up an operator. */
  operator: 'server/cli/operator.ts',
  /** `npm run backup`, `restore`, `backup:check`. */
  backup: 'server/backup/backup-cli.ts',
  restore: 'server/backup/restore-cli.ts',
  'backup-check': 'server/backup/check-cli.ts',
};

export const SERVER_OUT_DIR = join(root, 'dist', 'server');
export const SERVER_METAFILE = join(SERVER_OUT_DIR, 'meta.json');

/** The folder of development-only code, relative to the root, with a trailing separator. */
const DEV_FOLDER = `server${sep}dev${sep}`;
/** The one on-demand import of a development piece the production code holds (server/app.ts). */
const ON_DEMAND_DEV_IMPORT = { importer: join('server', 'app.ts'), path: './dev/mailbox.routes' };

/** Keeps server/dev/ out of the bundle (see the file's comment). */
const leaveOutDevPieces: Plugin = {
  name: 'leave-out-dev-pieces',
  setup(pluginBuild) {
    pluginBuild.onResolve({ filter: /(^|\/)dev\// }, (args) => {
      if (args.kind === 'entry-point' || !args.path.startsWith('.')) return undefined;
      const target = relative(root, join(args.resolveDir, args.path));
      if (!`${target}${sep}`.startsWith(DEV_FOLDER) && !target.startsWith(DEV_FOLDER)) return undefined;
      const importer = relative(root, args.importer);
      if (importer === ON_DEMAND_DEV_IMPORT.importer && args.path === ON_DEMAND_DEV_IMPORT.path && args.kind === 'dynamic-import') {
        return { path: target, namespace: 'left-out' };
      }
      return { errors: [{ text: `${importer} imports ${target}: server/dev/ is development-only and may not enter the production build.` }] };
    });
    pluginBuild.onLoad({ filter: /.*/, namespace: 'left-out' }, (args) => ({
      contents: `throw new Error(${JSON.stringify(`${args.path} is a development piece and is not part of the production build.`)});`,
      loader: 'js',
    }));
  },
};

export interface ServerBuild {
  metafile: Metafile;
  /** Size in bytes of each output JavaScript file, by entry name. */
  bytes: Record<string, number>;
}

/** Builds every entry point into `outDir` (emptied first) and writes the metafile beside them. */
export async function buildServer(outDir = SERVER_OUT_DIR): Promise<ServerBuild> {
  rmSync(outDir, { recursive: true, force: true });
  mkdirSync(outDir, { recursive: true });
  const result = await build({
    absWorkingDir: root,
    entryPoints: Object.entries(SERVER_ENTRY_POINTS).map(([out, source]) => ({ in: source, out })),
    outdir: outDir,
    bundle: true,
    platform: 'node',
    target: 'node20.19',
    format: 'cjs',
    packages: 'external',
    sourcemap: 'linked',
    // Stack traces name our source files and functions (pino logs them with every error).
    sourcesContent: false,
    keepNames: true,
    tsconfig: join(root, 'tsconfig.server.json'),
    define: { 'process.env.SPEEDWRIGHT_COMPILED_BUILD': '"1"' },
    plugins: [leaveOutDevPieces],
    metafile: true,
    logLevel: 'warning',
  });
  writeFileSync(join(outDir, 'meta.json'), JSON.stringify(result.metafile));
  const bytes: Record<string, number> = {};
  for (const name of Object.keys(SERVER_ENTRY_POINTS)) bytes[name] = statSync(join(outDir, `${name}.js`)).size;
  return { metafile: result.metafile, bytes };
}

if (require.main === module) {
  buildServer().then(
    ({ bytes }) => {
      const sizes = Object.entries(bytes).map(([name, size]) => `${name}.js ${(size / 1024).toFixed(0)} kB`);
      console.log(`Server built into ${relative(root, SERVER_OUT_DIR)}/: ${sizes.join(', ')}.`);
    },
    (error: unknown) => {
      console.error(error instanceof Error ? error.message : error);
      process.exit(1);
    },
  );
}
