import { describe, expect, it } from 'vitest';
import {
  collectionPrefix,
  generateLabelCodes,
  isLabelCode,
  LABEL_ALPHABET,
  normaliseLabelCode,
} from './label-codes';

describe('label codes', () => {
  it('use the QR alphanumeric set without look-alikes (ISO/IEC 18004 7.4.4; no O/0, I/1)', () => {
    expect(LABEL_ALPHABET).not.toMatch(/[O0I1]/);
    expect(LABEL_ALPHABET).toMatch(/^[0-9A-Z]+$/);
    expect(new Set(LABEL_ALPHABET).size).toBe(32);
    const codes = generateLabelCodes('NL', 200, Math.random);
    expect(new Set(codes).size).toBe(200);
    expect(codes.every(isLabelCode)).toBe(true);
    expect(normaliseLabelCode(' nl-7k3 ')).toBe('NL-7K3');
  });

  it('take the prefix a collection already uses, else its initials', () => {
    expect(collectionPrefix('Anything', ['NL-7K3', 'NL-QX4', 'AB-222'])).toBe('NL');
    // N, then I is not in the alphabet, so the next usable letter of the name: R.
    expect(collectionPrefix('Northlight Inverts', [])).toBe('NR');
    expect(collectionPrefix('Kim’s spiders', [])).toBe('KS');
    expect(collectionPrefix('Ö', [])).toBe('XX');
  });
});
