// @ts-check
const { createCjsPreset } = require('jest-preset-angular/presets');

/**
 * Three jest projects: the pure shared library, the server against a real MariaDB
 * instance, and the Angular client under jsdom. `npm run test:unit` and `npm run test:api`
 * pick them by name.
 */
const tsJest = ['ts-jest', { tsconfig: '<rootDir>/tsconfig.spec.json' }];

/** @type {import('jest').Config} */
module.exports = {
  projects: [
    {
      displayName: 'shared',
      testEnvironment: 'node',
      roots: ['<rootDir>/shared'],
      testMatch: ['**/*.spec.ts'],
      transform: { '^.+\\.ts$': tsJest },
    },
    {
      displayName: 'server',
      testEnvironment: 'node',
      roots: ['<rootDir>/server', '<rootDir>/db'],
      testMatch: ['**/*.spec.ts'],
      transform: { '^.+\\.ts$': tsJest },
      globalSetup: '<rootDir>/test/api/global-setup.ts',
      globalTeardown: '<rootDir>/test/api/global-teardown.ts',
      setupFiles: ['<rootDir>/test/api/env.ts'],
    },
    {
      displayName: 'client',
      ...createCjsPreset({ tsconfig: '<rootDir>/tsconfig.spec.json' }),
      roots: ['<rootDir>/src'],
      testMatch: ['**/*.spec.ts'],
      setupFilesAfterEnv: ['<rootDir>/src/setup-jest.ts'],
    },
  ],
};
