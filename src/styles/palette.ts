/**
 * Rackside's own palette: bark, moss, amber and clay on parchment; the same roles on a dark
 * bark ground; and a night theme of red on black that keeps a dark room dark.
 * Every text pair is checked ≥ 4.5:1 and every control/border ≥ 3:1 (WCAG 2.2, 1.4.3 and
 * 1.4.11) by palette.test.ts.
 */
export const THEMES = ['light', 'dark', 'night'] as const;
export type ThemeName = (typeof THEMES)[number];

export interface Palette {
  bg: string; // the page
  surface: string; // cards and bars
  text: string;
  muted: string; // secondary text
  border: string; // control outlines
  primary: string; // main buttons
  onPrimary: string; // text on main buttons
  accent: string; // pending / attention (amber)
  danger: string; // cautions, destructive (clay)
  ok: string; // done / saved (moss)
  focus: string; // focus ring
}

export const PALETTES: Record<ThemeName, Palette> = {
  light: {
    bg: '#f4ede1',
    surface: '#fffaf1',
    text: '#2a1f16',
    muted: '#5b4a3b',
    border: '#7d6650',
    primary: '#3d5a27',
    onPrimary: '#ffffff',
    accent: '#8a4b00',
    danger: '#a3341c',
    ok: '#2f6b2a',
    focus: '#1d5fa8',
  },
  dark: {
    bg: '#16120e',
    surface: '#241c15',
    text: '#f2e8d9',
    muted: '#cbb9a3',
    border: '#93806a',
    primary: '#a8cf7f',
    onPrimary: '#1a2410',
    accent: '#f0b14a',
    danger: '#f28b6b',
    ok: '#9fd39a',
    focus: '#8cc4ff',
  },
  night: {
    bg: '#000000',
    surface: '#0e0000',
    text: '#ff5c47',
    muted: '#e8503c',
    border: '#b8402e',
    primary: '#e0442f',
    onPrimary: '#000000',
    accent: '#ff8a66',
    danger: '#ff6a55',
    ok: '#ff5c47',
    focus: '#ffa090',
  },
};

export const PALETTE_KEYS = Object.keys(PALETTES.light) as (keyof Palette)[];

/** CSS custom property name for a palette role, e.g. --c-on-primary. */
export function cssVar(key: keyof Palette): string {
  return `--c-${key.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`)}`;
}
