/**
 * API integration tests: real PostgreSQL (a throwaway database per spec file,
 * copied from a migrated template made in global-setup) and a real local SMTP
 * server. @swc/jest, not ts-jest: ts-jest fails on NestJS 12's ESM packages.
 */
const swc = {
  jsc: {
    parser: { syntax: 'typescript', decorators: true },
    transform: { legacyDecorator: true, decoratorMetadata: true },
    target: 'es2022',
  },
  module: { type: 'commonjs' },
};

module.exports = {
  rootDir: __dirname,
  testEnvironment: 'node',
  roots: ['<rootDir>/test'],
  testMatch: ['**/*.spec.ts'],
  transform: { '^.+\\.(t|j)s$': ['@swc/jest', swc] },
  transformIgnorePatterns: ['/node_modules/(?!(@nestjs|file-type|load-esm|uid|@standard-schema|strtok3|token-types|@tokenizer)/)'],
  moduleNameMapper: {
    '^@sagline/common/(.*)$': '<rootDir>/../common/src/$1/index.ts',
    '^@sagline/database$': '<rootDir>/../database/index.ts',
  },
  globalSetup: '<rootDir>/test/support/global-setup.ts',
  globalTeardown: '<rootDir>/test/support/global-teardown.ts',
  testTimeout: 30000,
  // The machine is small and shared; two workers, each spec file with its own database.
  maxWorkers: 2,
};
