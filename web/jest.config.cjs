/**
 * Web component tests: ts-jest (transpile only, tsconfig.jest.json) in jsdom.
 * Run from the repository root: `npx jest -c web/jest.config.cjs`.
 */
module.exports = {
  rootDir: __dirname,
  roots: ['<rootDir>/src'],
  testMatch: ['**/*.spec.ts', '**/*.spec.tsx'],
  testEnvironment: '<rootDir>/src/testing/jsdom-environment.cjs',
  setupFilesAfterEnv: ['<rootDir>/src/testing/setup.ts'],
  transform: {
    '^.+\\.tsx?$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.jest.json' }],
  },
  moduleNameMapper: {
    '^@sagline/common/(.*)$': '<rootDir>/../common/src/$1',
    '^@/(.*)$': '<rootDir>/src/$1',
    // @ant-design/icons' CommonJS build requires one ESM file of the colours package.
    '^@ant-design/colors/es/(.*)$': '@ant-design/colors/lib/$1',
    '\\.css$': 'identity-obj-proxy',
    '\\.(woff2?|ttf|svg|png|jpe?g)$': '<rootDir>/src/testing/file-stub.cjs',
  },
  // antd animations and SWR timers: give slow, shared machines some room.
  testTimeout: 15000,
};
