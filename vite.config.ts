import path from 'node:path';
import tailwindcss from '@tailwindcss/vite';
import react from '@vitejs/plugin-react';
import type { Plugin } from 'vite';
import { VitePWA } from 'vite-plugin-pwa';
import { defineConfig } from 'vitest/config';
import { firstVisit } from './scripts/vite-first-visit.ts';
import { PALETTES } from './src/styles/palette.ts';

const alias = {
  '@': path.resolve(import.meta.dirname, 'src'),
  '#shared': path.resolve(import.meta.dirname, 'shared'),
};

/**
 * react-router 7's package exports name only its development build (with its warnings and
 * checks), so a production build would ship that: take its production files by path.
 */
const routerDist = path.resolve(import.meta.dirname, 'node_modules/react-router/dist/production');
const productionAlias = [
  { find: /^react-router$/, replacement: path.join(routerDist, 'index.mjs') },
  { find: /^react-router\/dom$/, replacement: path.join(routerDist, 'dom-export.mjs') },
];

/**
 * Preloads the font weights the first screen uses, so the heading is not painted twice (once in
 * a fallback face, again when the weight arrives) — that second paint was the offline LCP (P2).
 */
function preloadFirstScreenFonts(): Plugin {
  return {
    name: 'rackside-preload-fonts',
    apply: 'build',
    transformIndexHtml: {
      order: 'post',
      handler(_html, ctx) {
        const files = Object.keys(ctx.bundle ?? {}).filter((f) =>
          /nunito-latin-(400|700|800)-normal-[\w-]+\.woff2$/.test(f),
        );
        return files.map((f) => ({
          tag: 'link',
          attrs: { rel: 'preload', as: 'font', type: 'font/woff2', href: `/${f}`, crossorigin: '' },
          injectTo: 'head' as const,
        }));
      },
    },
  };
}

export default defineConfig(({ command, mode }) => ({
  resolve: {
    alias: [
      ...Object.entries(alias).map(([find, replacement]) => ({ find, replacement })),
      ...(command === 'build' && mode === 'production' ? productionAlias : []),
    ],
  },
  plugins: [
    react(),
    tailwindcss(),
    preloadFirstScreenFonts(),
    firstVisit(),
    VitePWA({
      registerType: 'prompt',
      injectRegister: false,
      includeManifestIcons: false,
      manifest: {
        name: 'Rackside',
        short_name: 'Rackside',
        description:
          'The feeding round for tarantulas and other invertebrates, on your phone, with or without signal.',
        id: '/',
        start_url: '/today',
        scope: '/',
        display: 'standalone',
        orientation: 'portrait',
        background_color: PALETTES.dark.bg,
        theme_color: PALETTES.dark.bg,
        icons: [
          { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png', purpose: 'any' },
          { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'any' },
          {
            src: '/icons/icon-maskable-512.png',
            sizes: '512x512',
            type: 'image/png',
            purpose: 'maskable',
          },
        ],
      },
      workbox: {
        // Latin subsets only (setup notes, trap 4): every font file we ship is precached once.
        globPatterns: ['**/*.{js,css,html,woff2,png,svg,webmanifest}'],
        navigateFallback: '/index.html',
        navigateFallbackDenylist: [/^\/api/],
        cleanupOutdatedCaches: true,
      },
    }),
  ],
  server: {
    proxy: { '/api': `http://127.0.0.1:${process.env.API_PORT ?? 3001}` },
  },
  build: {
    sourcemap: false,
    chunkSizeWarningLimit: 600,
  },
  test: {
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'unit',
          include: [
            'shared/**/*.test.ts',
            'src/**/*.test.{ts,tsx}',
            'server/**/*.test.ts',
            'scripts/**/*.test.ts',
          ],
          environment: 'node',
          setupFiles: ['tests/setup/fail-on-console-error.ts'],
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/setup/database-template.ts'],
          setupFiles: ['tests/setup/fail-on-console-error.ts'],
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/setup/database-template.ts'],
          setupFiles: ['tests/setup/fail-on-console-error.ts'],
          fileParallelism: false,
          testTimeout: 120_000,
          hookTimeout: 120_000,
          // A page that waits on the server or a lazy chunk can take more than poll's 1 s default.
          expect: { poll: { timeout: 5_000 } },
        },
      },
    ],
  },
}));
