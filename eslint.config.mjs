// @ts-check
/**
 * `npm run lint` (run by `npm test` before the jest phases). Three parts:
 * 1. typescript-eslint's recommended rules on every TypeScript file; angular-eslint's recommended
 *    rules on the client's TypeScript and its templates (inline and `.html`), with the
 *    accessibility rules for templates.
 * 2. Import boundaries, on production files only (tests may cross them):
 *    client (`src/`) ↛ `server/`, `db/`; `server/`, `db/` ↛ `src/`; `shared/` ↛ `src/`, `server/`, `db/`;
 *    `db/migrations/` ↛ anything but `../migration` (the `Migration` type) and `./frozen/…` (frozen copies);
 *    production ↛ `test/` and any `testing/` folder.
 *    ESLint's `no-restricted-imports` reads the import text of `import … from` and `export … from`;
 *    `no-restricted-syntax` applies the same patterns to `import()` (lazy routes) and `require()`.
 *    Outside `shared/`, shared code is imported through the `@shared/…` alias (tsconfig.json's
 *    `paths`), never by a relative path that climbs to it (tests included).
 * 3. The few rules switched off, each with its reason.
 */
import js from '@eslint/js';
import angular from 'angular-eslint';
import tseslint from 'typescript-eslint';

/** Import texts that reach a top-level folder of the repository (`../../server/…`). */
const reaches = (/** @type {string[]} */ folders) => `^(\\.\\./)+(${folders.join('|')})(/|$)`;

const TEST_SUPPORT = {
  // `test-helpers` and `…fixtures` files too, wherever they still sit (server/speed-books/test-helpers.ts).
  regex: `(^|/)testing(/|$)|(^|/)(test-helpers|[\\w-]*fixtures)$|${reaches(['test'])}`,
  message: 'Test support (a `testing/` folder, `test/`, a test-helpers or fixtures file) is for tests only; production code never imports it.',
};

const SHARED_BY_ALIAS = {
  regex: reaches(['shared']),
  message: 'Import shared code as `@shared/…` (tsconfig.json `paths`), not by a relative path that climbs to `shared/`.',
};

/**
 * The rules of one boundary: no-restricted-imports with the test-support pattern and `more`, and
 * the same patterns for `import()` and `require()` (esquery reads a regex up to the first `/`,
 * so a slash is written `\x2F`).
 */
const boundary = (/** @type {{ regex: string; message: string }[]} */ ...more) => {
  const patterns = [TEST_SUPPORT, ...more];
  const imports = [...patterns, SHARED_BY_ALIAS];
  const literal = (/** @type {string} */ regex) => `/${regex.replaceAll('/', '\\x2F')}/`;
  return {
    'no-restricted-imports': ['error', { patterns: imports }],
    'no-restricted-syntax': [
      'error',
      ...patterns.flatMap(({ regex, message }) => [
        { selector: `ImportExpression[source.value=${literal(regex)}]`, message },
        { selector: `CallExpression[callee.name='require'][arguments.0.value=${literal(regex)}]`, message },
      ]),
    ],
  };
};

/** Files that are tests or test support, exempt from the boundaries. */
const TESTS = ['**/*.spec.ts', '**/*.bench.ts', '**/testing/**', 'src/setup-jest.ts', 'server/speed-books/test-helpers.ts'];

export default tseslint.config(
  { ignores: ['dist/**', '.angular/**', '.data/**', 'node_modules/**', 'coverage/**', 'public/**', 'src/fonts/**'] },
  {
    files: ['**/*.ts'],
    extends: [js.configs.recommended, ...tseslint.configs.recommended],
    rules: {
      // TypeScript itself reports undefined names (and knows the DOM and Node globals per tsconfig).
      'no-undef': 'off',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none', ignoreRestSiblings: true }],
      // require() only for CommonJS packages an import would break or that have no typings:
      // pdfmake's Node build (an instance whose methods live on its prototype; import interop
      // copies own properties only), and pngjs and fontkit in tests (untyped; typed at the call).
      '@typescript-eslint/no-require-imports': ['error', { allow: ['^pdfmake$', '^pngjs$', '^fontkit$'] }],
    },
  },
  {
    // Applies to tests too; production files repeat the pattern inside their boundary rules below,
    // because a later block's no-restricted-imports replaces an earlier one's.
    files: ['src/**/*.ts', 'server/**/*.ts', 'db/**/*.ts', 'test/**/*.ts', 'tools/**/*.ts'],
    rules: { 'no-restricted-imports': ['error', { patterns: [SHARED_BY_ALIAS] }] },
  },
  {
    files: ['src/**/*.ts'],
    extends: [...angular.configs.tsRecommended],
    processor: angular.processInlineTemplates,
  },
  {
    files: ['src/**/*.html'],
    extends: [...angular.configs.templateRecommended, ...angular.configs.templateAccessibility],
  },
  {
    files: ['src/**/*.ts'],
    ignores: TESTS,
    rules: {
      ...boundary({ regex: reaches(['server', 'db']), message: 'The client never imports the server or the database; share through `shared/`.' }),
      // style.md: every component OnPush (51 of 51 today); stand-ins inside specs are exempt.
      '@angular-eslint/prefer-on-push-component-change-detection': 'error',
      '@angular-eslint/component-selector': ['error', { type: 'element', prefix: 'sw', style: 'kebab-case' }],
      '@angular-eslint/directive-selector': ['error', { type: 'attribute', prefix: 'sw', style: 'camelCase' }],
    },
  },
  {
    files: ['server/**/*.ts', 'db/**/*.ts'],
    ignores: [...TESTS, 'db/migrations/**'],
    rules: {
      ...boundary({ regex: reaches(['src']), message: 'The server never imports the client; share through `shared/`.' }),
    },
  },
  {
    files: ['db/migrations/**/*.ts'],
    ignores: TESTS,
    rules: {
      ...boundary({
        regex: '^\\.\\./(?!migration$)|^@shared/',
        message: 'A migration never imports live code (it must do the same whenever it runs): copy what it needs into `db/migrations/frozen/` and never change the copy.',
      }),
    },
  },
  {
    files: ['shared/**/*.ts'],
    ignores: TESTS,
    rules: {
      ...boundary(
        { regex: reaches(['src', 'server', 'db']), message: '`shared/` is used by client and server and imports neither.' },
        { regex: '^@shared/', message: 'Inside `shared/`, import by relative path: the alias is for the code that uses `shared/`.' },
      ),
    },
  },
);
