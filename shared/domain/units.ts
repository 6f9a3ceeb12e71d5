/**
 * 1 in = 25.4 mm exactly (international yard and pound agreement, 1959; NIST Special Publication
 * 811, 2008 edition, Appendix B.8 — from memory).
 */
export const MM_PER_INCH = 25.4;

export const SIZE_UNITS = ['mm', 'in'] as const;
export type SizeUnit = (typeof SIZE_UNITS)[number];

/** Sizes are stored in millimetres to a tenth, finer than anyone measures a leg span. */
const toTenth = (mm: number) => Math.round(mm * 10) / 10;
/** Inches are shown to a hundredth (0.254 mm), which the tenth-of-a-millimetre store keeps. */
const toHundredth = (inches: number) => Math.round(inches * 100) / 100;

export function inchesToMm(inches: number): number {
  return toTenth(inches * MM_PER_INCH);
}

export function mmToInches(mm: number): number {
  return toHundredth(mm / MM_PER_INCH);
}

/** A stored size in the person's unit, as a number for a form field. */
export function sizeInUnit(mm: number, unit: SizeUnit): number {
  return unit === 'mm' ? toTenth(mm) : mmToInches(mm);
}

/** What a person typed, in their unit, as the millimetres to store. */
export function sizeToMm(value: number, unit: SizeUnit): number {
  return unit === 'mm' ? toTenth(value) : inchesToMm(value);
}

export function formatSize(mm: number | null, unit: SizeUnit): string {
  if (mm === null) return '—';
  const value = sizeInUnit(mm, unit);
  return unit === 'mm' ? `${value} mm` : `${value} in`;
}
