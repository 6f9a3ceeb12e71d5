import { describe, expect, it } from 'vitest';
import {
  codeKey,
  generateLabelTag,
  isLabelTag,
  labelRoute,
  labelUrl,
  readLabel,
} from './label-payload';

describe('label payloads', () => {
  it('puts an upper-case URL on the label and reads it back', () => {
    const url = labelUrl('http://localhost:3000/', 'ABCD', 'NL-7K3');
    expect(url).toBe('HTTP://LOCALHOST:3000/L/ABCD/NL-7K3');
    expect(readLabel(url)).toEqual({ kind: 'label', tag: 'ABCD', code: 'NL-7K3' });
    expect(labelRoute('ABCD', 'NL-7K3')).toBe('/l/ABCD/NL-7K3');
  });

  it('reads the address a phone camera app opens (host lower-cased, path kept)', () => {
    expect(readLabel('http://localhost:3000/L/ABCD/NL-7K3')).toEqual({
      kind: 'label',
      tag: 'ABCD',
      code: 'NL-7K3',
    });
    expect(readLabel('https://x.example/l/abcd/nl-7k3/')).toEqual({
      kind: 'label',
      tag: 'ABCD',
      code: 'NL-7K3',
    });
  });

  it('normalises typed codes: any case, stray spaces', () => {
    expect(readLabel('  nl-7k3 ')).toEqual({ kind: 'code', code: 'NL-7K3' });
    expect(readLabel('n l - 7 k 3')).toEqual({ kind: 'code', code: 'NL-7K3' });
    expect(readLabel('nl7k3')).toEqual({ kind: 'code', code: 'NL7K3' });
    expect(codeKey(' nl-7k3')).toBe(codeKey('NL7K3'));
  });

  it('tells a damaged label from a foreign QR', () => {
    // Look-alikes are not in the alphabet, so O and 1 mark a code as malformed.
    expect(readLabel('NL-7KO')).toEqual({ kind: 'malformed' });
    expect(readLabel('NL-71K')).toEqual({ kind: 'malformed' });
    expect(readLabel('HTTP://LOCALHOST:3000/L/AB/NL-7K3')).toEqual({ kind: 'malformed' });
    expect(readLabel('HTTP://LOCALHOST:3000/L/ABCD/NOT A CODE!')).toEqual({ kind: 'malformed' });
    expect(readLabel('')).toEqual({ kind: 'malformed' });
    expect(readLabel('https://example.com/menu')).toEqual({ kind: 'foreign' });
    expect(readLabel('WIFI:S:home;T:WPA;P:secret;;')).toEqual({ kind: 'foreign' });
    expect(readLabel('Buy crickets at the shop on Main Street')).toEqual({ kind: 'foreign' });
    expect(readLabel('http://[bad')).toEqual({ kind: 'foreign' });
  });

  it('makes collection tags from the label alphabet', () => {
    let n = 0;
    const tag = generateLabelTag(() => (n++ % 10) / 10);
    expect(isLabelTag(tag)).toBe(true);
    expect(isLabelTag('AB0D')).toBe(false);
  });
});
