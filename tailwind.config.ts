import type { Config } from 'tailwindcss';
import plugin from 'tailwindcss/plugin';
import { cssVar, PALETTE_KEYS, PALETTES, THEMES } from './src/styles/palette.ts';

const colors = Object.fromEntries(
  PALETTE_KEYS.map((key) => [
    key.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`),
    `var(${cssVar(key)})`,
  ]),
);

export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors,
      fontFamily: { sans: ['Nunito', 'system-ui', 'sans-serif'] },
      minHeight: { target: '48px' },
      minWidth: { target: '48px' },
    },
  },
  plugins: [
    // One set of custom properties per theme, chosen by <html data-theme="…">.
    plugin(({ addBase }) => {
      for (const theme of THEMES) {
        const selector =
          theme === 'light' ? ':root, [data-theme="light"]' : `[data-theme="${theme}"]`;
        addBase({
          [selector]: {
            ...Object.fromEntries(PALETTE_KEYS.map((key) => [cssVar(key), PALETTES[theme][key]])),
            'color-scheme': theme === 'light' ? 'light' : 'dark',
          },
        });
      }
    }),
  ],
} satisfies Config;
