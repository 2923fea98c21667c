// Browser tests: Debian's Chromium driven by playwright-core, against the built app served by the real server.
module.exports = {
  displayName: 'browser',
  rootDir: __dirname,
  testEnvironment: 'node',
  testMatch: ['<rootDir>/**/*.e2e.ts'],
  testTimeout: 60000,
  globalSetup: '<rootDir>/support/global-setup.ts',
  globalTeardown: '<rootDir>/support/global-teardown.ts',
  transform: { '^.+\\.ts$': ['@swc/jest', { jsc: { parser: { syntax: 'typescript' }, target: 'es2022' } }] },
};
