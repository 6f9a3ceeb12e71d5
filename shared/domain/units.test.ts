import { describe, expect, it } from 'vitest';
import { formatSize, inchesToMm, MM_PER_INCH, mmToInches, sizeInUnit, sizeToMm } from './units';

describe('leg-span units', () => {
  it('uses 1 in = 25.4 mm exactly (international yard and pound agreement, 1959)', () => {
    expect(MM_PER_INCH).toBe(25.4);
    expect(inchesToMm(1)).toBe(25.4);
    expect(inchesToMm(5)).toBe(127);
    expect(mmToInches(127)).toBe(5);
    expect(formatSize(130, 'mm')).toBe('130 mm');
    expect(formatSize(130, 'in')).toBe('5.12 in');
    expect(formatSize(null, 'in')).toBe('—');
  });

  it('round-trips inches shown to a hundredth without drift', () => {
    for (let hundredths = 1; hundredths <= 1200; hundredths++) {
      const inches = hundredths / 100;
      expect(sizeInUnit(sizeToMm(inches, 'in'), 'in')).toBe(inches);
    }
  });

  it('settles after one trip from millimetres: saving an unchanged form never walks the value', () => {
    for (let tenths = 1; tenths <= 3000; tenths++) {
      const once = sizeToMm(sizeInUnit(tenths / 10, 'in'), 'in');
      const twice = sizeToMm(sizeInUnit(once, 'in'), 'in');
      expect(twice).toBe(once);
      expect(Math.abs(once - tenths / 10)).toBeLessThanOrEqual(0.13); // half a hundredth of an inch
    }
    expect(sizeToMm(sizeInUnit(130, 'mm'), 'mm')).toBe(130);
  });
});
