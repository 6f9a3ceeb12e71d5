import fs from 'node:fs';
import path from 'node:path';
import js from '@eslint/js';
import importX from 'eslint-plugin-import-x';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

const here = import.meta.dirname;
const foldersIn = (dir) =>
  fs
    .readdirSync(path.join(here, dir), { withFileTypes: true })
    .filter((d) => d.isDirectory())
    .map((d) => d.name);

// Every client feature folder, as it is on disk: a new one is covered without editing this file.
const FEATURES = foldersIn('src/features');

// The server's features in layer order, lowest first: each may import only those before it, so
// the folders can never form a cycle. A new feature folder must be placed here (checked below).
const SERVER_LAYERS = [
  'events',
  'auth',
  'photos',
  'health',
  'lan',
  'labels',
  'locations',
  'animals',
  'breeding',
  'collections',
  'dev',
  'rounds',
  'chores',
  'colonies',
  'cover',
  'helper-reports',
  'climate',
  'listings',
  'care-sheets',
  'availability',
  'sales',
  'payments',
  'data',
];
const unplaced = foldersIn('server/features').filter((f) => !SERVER_LAYERS.includes(f));
if (unplaced.length)
  throw new Error(
    `eslint.config.js: place server/features/${unplaced.join(', ')} in SERVER_LAYERS.`,
  );

const NO_SERVER_IN_CLIENT = {
  group: ['**/server/**'],
  message: 'The client must not import server code.',
};

export default tseslint.config(
  {
    ignores: [
      'dist',
      'node_modules',
      '.data',
      'test-results',
      'drizzle',
      'coverage',
      'bench/.minimal-dist',
      'dist-server',
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    plugins: { 'import-x': importX },
    settings: {
      'import-x/internal-regex': '^(#shared|@)/',
      // Let import-x read TypeScript files it follows (no-cycle walks them).
      'import-x/extensions': ['.ts', '.tsx', '.js', '.mjs'],
      'import-x/parsers': { '@typescript-eslint/parser': ['.ts', '.tsx'] },
      'import-x/resolver-next': [
        importX.createNodeResolver({
          extensions: ['.ts', '.tsx', '.js', '.mjs', '.json'],
          tsconfig: { configFile: path.join(here, 'tsconfig.json') },
        }),
      ],
    },
    rules: {
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_' },
      ],
      'import-x/order': [
        'error',
        {
          groups: ['builtin', 'external', 'internal', 'parent', 'sibling', 'index'],
          alphabetize: { order: 'asc', caseInsensitive: true },
        },
      ],
      // No file imports itself back through others; the folder rules below keep layers acyclic.
      'import-x/no-cycle': ['error', { ignoreExternal: true }],
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
      'no-restricted-imports': ['error', { patterns: [NO_SERVER_IN_CLIENT] }],
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
            {
              group: FEATURES.filter((f) => f !== feature).map((f) => `@/features/${f}/**`),
              message: 'Features do not import each other: compose them in src/app.',
            },
            { group: ['@/app/**'], message: 'Features do not import the app layer.' },
            NO_SERVER_IN_CLIENT,
          ],
        },
      ],
    },
  })),
  {
    // A route is a page: it composes features and panels (src/app/panels), never another route.
    files: ['src/app/routes/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            NO_SERVER_IN_CLIENT,
            {
              group: ['@/app/routes/**', './*', '../routes/**'],
              message:
                'Routes do not import each other: move the shared part to src/app/panels or a feature.',
            },
          ],
        },
      ],
    },
  },
  {
    // One way to reach shared code on both sides.
    files: ['server/**/*.ts', 'tests/**/*.ts', 'bench/**/*.{ts,tsx}', 'src/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['../**/shared/**', './shared/**'],
              message: 'Import shared code as #shared/….',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['server/**/*.ts'],
    plugins: { 'import-x': importX },
    rules: {
      'import-x/no-restricted-paths': [
        'error',
        {
          basePath: here,
          zones: [
            // Each server feature imports only features in lower layers.
            ...SERVER_LAYERS.map((feature, i) => ({
              target: `server/features/${feature}`,
              from: SERVER_LAYERS.slice(i + 1).map((f) => `server/features/${f}`),
              message: `server/features/${feature} sits below these in SERVER_LAYERS (eslint.config.js).`,
            })).filter((zone) => zone.from.length),
            // Below the features: they import no feature, and nothing app-level.
            ...['server/access', 'server/db', 'server/middleware', 'server/mail'].map((target) => ({
              target,
              from: ['server/features', 'server/seed', 'server/jobs', 'server/app.ts'],
              message:
                'The layers below the features import no feature (see DEVELOPERS.md, Layout rules).',
            })),
            // A feature's repository is private: other features call its service.
            ...SERVER_LAYERS.map((feature) => ({
              target: [
                ...SERVER_LAYERS.filter((f) => f !== feature).map((f) => `server/features/${f}/**`),
                'server/*.ts',
                'server/seed/**',
                'server/jobs/**',
              ],
              from: `server/features/${feature}/*.repository.ts`,
              message: "A repository is private to its feature: call the feature's service.",
            })),
          ],
        },
      ],
    },
  },
  {
    // shared/ is imported by both sides and imports neither.
    files: ['shared/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['**/server/**', '**/src/**', '@/**', 'drizzle-orm*', 'react*'],
              message: 'shared/ imports nothing from the client, the server or Drizzle.',
            },
          ],
        },
      ],
    },
  },
);
