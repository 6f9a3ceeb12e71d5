import { PALETTES, THEMES, type ThemeName } from '@/styles/palette';

const KEY = 'rackside.theme';

export function storedTheme(): ThemeName {
  const saved = localStorage.getItem(KEY);
  return (THEMES as readonly string[]).includes(saved ?? '') ? (saved as ThemeName) : 'dark';
}

/** Sets the theme on <html> and the browser chrome colour, and remembers it on this device. */
export function applyTheme(theme: ThemeName) {
  document.documentElement.dataset.theme = theme;
  document.querySelector('meta[name="theme-color"]')?.setAttribute('content', PALETTES[theme].bg);
  localStorage.setItem(KEY, theme);
}
