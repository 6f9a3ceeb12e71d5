import js from '@eslint/js';
import importX from 'eslint-plugin-import-x';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

const FEATURES = ['animals', 'app-update', 'auth', 'dev-mailbox', 'settings', 'rounds', 'scan', 'labels', 'cover', 'breeding'];

export default tseslint.config(
  { ignores: ['dist', 'node_modules', '.data', 'test-results', 'drizzle', 'coverage', 'bench/.minimal-dist', 'dist-server'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    plugins: { 'import-x': importX },
    settings: { 'import-x/internal-regex': '^(#shared|@)/' },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      'import-x/order': ['error', { groups: ['builtin', 'external', 'internal', 'parent', 'sibling', 'index'], alphabetize: { order: 'asc', caseInsensitive: true } }],
      'import-x/no-cycle': 'off',
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: {
      ...reactHooks.configs.recommended.rules,
      // This only tells React Compiler users what it skips; we do not compile with it.
      'react-hooks/incompatible-library': 'off',
      // The client reaches the server only over HTTP.
      'no-restricted-imports': ['error', { patterns: [{ group: ['**/server/**'], message: 'The client must not import server code.' }] }],
    },
  },
  // Features do not import each other; app/ composes them.
  ...FEATURES.map((feature) => ({
    files: [`src/features/${feature}/**/*.{ts,tsx}`],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: FEATURES.filter((f) => f !== feature).map((f) => `@/features/${f}/**`), message: 'Features do not import each other: compose them in src/app.' },
            { group: ['@/app/**'], message: 'Features do not import the app layer.' },
          ],
        },
      ],
    },
  })),
  {
    // shared/ is imported by both sides and imports neither.
    files: ['shared/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', { patterns: [{ group: ['**/server/**', '**/src/**', '@/**', 'drizzle-orm*', 'react*'], message: 'shared/ imports nothing from the client, the server or Drizzle.' }] }],
    },
  },
);
