// Backend unit tests (src, *.spec.ts) and integration tests (test, *.e2e-spec.ts), on the real PostgreSQL.
module.exports = {
  displayName: 'backend',
  rootDir: __dirname,
  testEnvironment: 'node',
  roots: ['<rootDir>/src', '<rootDir>/test'],
  testRegex: '.*\\.(spec|e2e-spec)\\.ts$',
  testTimeout: 30000,
  globalSetup: '<rootDir>/test/global-setup.ts',
  moduleNameMapper: {
    '^@amberline/common$': '<rootDir>/../common/src/index.ts',
    '^@amberline/seed$': '<rootDir>/../seed/src/index.ts',
  },
  transform: {
    '^.+\\.ts$': ['@swc/jest', { jsc: { parser: { syntax: 'typescript', decorators: true }, transform: { legacyDecorator: true, decoratorMetadata: true }, target: 'es2022' } }],
  },
};
