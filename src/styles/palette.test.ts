import { describe, expect, it } from 'vitest';
import { PALETTES, THEMES, type Palette } from './palette';

// WCAG 2.2, "relative luminance" and "contrast ratio" definitions (Understanding SC 1.4.3).
function luminance(hex: string): number {
  const channels = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255);
  const [r, g, b] = channels.map((c) =>
    c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4,
  ) as [number, number, number];
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}
export function contrast(a: string, b: string): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x) as [number, number];
  return (hi + 0.05) / (lo + 0.05);
}

describe('contrast formula', () => {
  it('matches the worked extremes of WCAG 2.2 (black on white is 21:1, equal colours 1:1)', () => {
    expect(contrast('#000000', '#ffffff')).toBeCloseTo(21, 5);
    expect(contrast('#777777', '#777777')).toBe(1);
    // #767676 on white is the well-known lightest grey passing 4.5:1 (from memory: 4.54:1).
    expect(contrast('#767676', '#ffffff')).toBeCloseTo(4.54, 2);
  });
});

describe.each(THEMES)('%s theme', (theme) => {
  const p: Palette = PALETTES[theme];
  const grounds = [p.bg, p.surface];
  // WCAG 2.2 SC 1.4.3: text at least 4.5:1.
  it.each(['text', 'muted', 'accent', 'danger', 'ok'] as const)(
    '%s text reads on page and cards (≥ 4.5:1)',
    (role) => {
      for (const ground of grounds) expect(contrast(p[role], ground)).toBeGreaterThanOrEqual(4.5);
    },
  );
  it('button text reads on the primary colour (≥ 4.5:1)', () => {
    expect(contrast(p.onPrimary, p.primary)).toBeGreaterThanOrEqual(4.5);
  });
  // WCAG 2.2 SC 1.4.11: user-interface components at least 3:1 against adjacent colours.
  it.each(['border', 'primary', 'focus'] as const)(
    '%s stands out from page and cards (≥ 3:1)',
    (role) => {
      for (const ground of grounds) expect(contrast(p[role], ground)).toBeGreaterThanOrEqual(3);
    },
  );
});

describe('caution chips in the night theme (filled, see index.css)', () => {
  const p = PALETTES.night;
  it('their text reads on the filled chip (≥ 4.5:1) and the chip stands out from the card (≥ 3:1)', () => {
    expect(contrast(p.bg, p.danger)).toBeGreaterThanOrEqual(4.5);
    for (const ground of [p.bg, p.surface])
      expect(contrast(p.danger, ground)).toBeGreaterThanOrEqual(3);
  });
  it('a filled chip differs from plain text around it (text on ground vs ground on danger)', () => {
    // Plain night text is red on black; a chip is black on red: the polarity flips, so it is
    // seen as a mark, not read as one more line (the reason it is filled in this theme).
    expect(contrast(p.text, p.danger)).toBeLessThan(1.5);
    expect(contrast(p.bg, p.danger)).toBeGreaterThan(7);
  });
});
