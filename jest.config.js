// @ts-check
const { createCjsPreset } = require('jest-preset-angular/presets');

/**
 * Five jest projects: the pure shared library, the server against a real MariaDB instance,
 * end-to-end in Debian's Chromium against the production build, the Angular client under
 * jsdom, and the production path (the build installed with production dependencies only).
 * `npm run test:unit`, `test:api`, `test:e2e` and `test:production` pick them by name.
 */
const tsJest = ['ts-jest', { tsconfig: '<rootDir>/tsconfig.spec.json' }];

/** `@shared/…` is the repository's `shared/` folder (tsconfig.json's `paths`). */
const moduleNameMapper = { '^@shared/(.*)$': '<rootDir>/shared/$1' };

/** @type {import('jest').Config} */
module.exports = {
  projects: [
    {
      displayName: 'shared',
      testEnvironment: 'node',
      roots: ['<rootDir>/shared'],
      testMatch: ['**/*.spec.ts'],
      transform: { '^.+\\.ts$': tsJest },
      moduleNameMapper,
    },
    {
      displayName: 'server',
      testEnvironment: 'node',
      roots: ['<rootDir>/server', '<rootDir>/db'],
      testMatch: ['**/*.spec.ts'],
      transform: { '^.+\\.ts$': tsJest },
      moduleNameMapper,
      globalSetup: '<rootDir>/test/api/global-setup.ts',
      globalTeardown: '<rootDir>/test/api/global-teardown.ts',
      setupFiles: ['<rootDir>/test/api/env.ts'],
      setupFilesAfterEnv: ['<rootDir>/test/api/timeouts.ts'],
    },
    {
      displayName: 'e2e',
      testEnvironment: 'node',
      roots: ['<rootDir>/test/e2e'],
      testMatch: ['**/*.e2e.ts'],
      transform: { '^.+\\.ts$': tsJest },
      moduleNameMapper,
      globalSetup: '<rootDir>/test/e2e/global-setup.ts',
      globalTeardown: '<rootDir>/test/e2e/global-teardown.ts',
      setupFiles: ['<rootDir>/test/e2e/env.ts'],
      setupFilesAfterEnv: ['<rootDir>/test/e2e/timeouts.ts'],
    },
    {
      displayName: 'production',
      testEnvironment: 'node',
      roots: ['<rootDir>/test/production'],
      testMatch: ['**/*.spec.ts'],
      transform: { '^.+\\.ts$': tsJest },
      moduleNameMapper,
    },
    {
      displayName: 'client',
      ...createCjsPreset({ tsconfig: '<rootDir>/tsconfig.spec.json' }),
      moduleNameMapper,
      roots: ['<rootDir>/src'],
      testMatch: ['**/*.spec.ts'],
      setupFilesAfterEnv: ['<rootDir>/src/setup-jest.ts'],
    },
  ],
};
