const swc = { jsc: { parser: { syntax: 'typescript' }, target: 'es2022' }, module: { type: 'commonjs' } };
/** Unit tests of the pure package: engine, limits, units, schedule rules; plus the engine's reference checks in test/reference/engine. */
module.exports = {
  testEnvironment: 'node',
  roots: ['<rootDir>/src', '<rootDir>/bin', '<rootDir>/../test/reference/engine'],
  testMatch: ['**/*.spec.ts'],
  transform: { '^.+\\.(t|j)s$': ['@swc/jest', swc] },
};
