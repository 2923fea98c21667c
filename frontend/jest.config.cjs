/** Unit tests of the web app's pure parts (drawing placement, query keys, times, errors, access): Node, no browser. */
module.exports = {
  displayName: 'frontend',
  rootDir: __dirname,
  testEnvironment: 'node',
  roots: ['<rootDir>/src'],
  testMatch: ['**/*.test.ts', '**/*.test.tsx'],
  // the shared package is taken from its TypeScript source, as Vite does
  moduleNameMapper: { '^@amberline/common$': '<rootDir>/../common/src/index.ts' },
  transform: {
    '^.+\\.tsx?$': ['@swc/jest', { jsc: { parser: { syntax: 'typescript', tsx: true }, transform: { react: { runtime: 'automatic' } }, target: 'es2022' } }],
  },
};
