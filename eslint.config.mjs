// Lint for the web app, the server and the shared package: TypeScript, React hooks, import boundaries and file names.
import js from '@eslint/js';
import checkFile from 'eslint-plugin-check-file';
import importPlugin from 'eslint-plugin-import';
import reactHooks from 'eslint-plugin-react-hooks';
import tseslint from 'typescript-eslint';

const FEATURES = ['escorts', 'fleet', 'moves', 'permits', 'rulebook', 'run-sheets', 'users'];

export default tseslint.config(
  { ignores: ['**/dist/**', '**/node_modules/**', 'frontend/e2e/**', '**/*.cjs'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['frontend/src/**/*.{ts,tsx}'],
    plugins: { import: importPlugin, 'react-hooks': reactHooks, 'check-file': checkFile },
    languageOptions: { globals: { window: 'readonly', document: 'readonly', localStorage: 'readonly', fetch: 'readonly' } },
    settings: {
      'import/resolver': { typescript: { project: 'frontend/tsconfig.json' }, node: true },
      'import/parsers': { '@typescript-eslint/parser': ['.ts', '.tsx'] },
    },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'warn',
      'import/no-cycle': 'error',
      // shared → features → app: a feature never imports another feature, lib and components never import features or app
      'import/no-restricted-paths': [
        'error',
        {
          zones: [
            ...FEATURES.map((f) => ({
              target: `./frontend/src/features/${f}`,
              from: './frontend/src/features',
              except: [`./${f}`],
              message: 'A feature does not import another feature: move the shared part to src/components or src/lib, or compose them in src/app.',
            })),
            { target: './frontend/src/lib', from: ['./frontend/src/features', './frontend/src/app'], message: 'lib owns its fetchers and imports no feature.' },
            { target: './frontend/src/components', from: ['./frontend/src/features', './frontend/src/app'], message: 'Shared components import no feature.' },
            { target: './frontend/src/features', from: './frontend/src/app', message: 'Features do not import the app.' },
          ],
        },
      ],
      'check-file/filename-naming-convention': ['error', { 'frontend/src/**/*.{ts,tsx}': 'KEBAB_CASE' }, { ignoreMiddleExtensions: true }],
      'check-file/folder-naming-convention': ['error', { 'frontend/src/**/': 'KEBAB_CASE' }],
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
    },
  },
  {
    // the server and the shared package: TypeScript's recommended rules, kebab-case file names
    files: ['backend/src/**/*.ts', 'common/src/**/*.ts'],
    plugins: { 'check-file': checkFile },
    languageOptions: { globals: { process: 'readonly', require: 'readonly', __dirname: 'readonly', module: 'writable', console: 'readonly' } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
      'check-file/filename-naming-convention': ['error', { '{backend,common}/src/**/*.ts': 'KEBAB_CASE' }, { ignoreMiddleExtensions: true }],
    },
  },
  {
    // migrations are named <timestamp>-<kebab-case name>, the order they run in
    files: ['backend/src/database/migrations/*.ts'],
    rules: { 'check-file/filename-naming-convention': 'off' },
  },
  {
    // tests may reach into shapes with `any` to feed bad input
    files: ['**/*.test.ts', '**/*.spec.ts'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
);
