import { describe, expect, it } from 'vitest';
import { nfcProblem, nfcProblemWords } from './web-nfc';

describe('Web NFC problems in words', () => {
  // DOMException names from the W3C Web NFC report's write and scan steps (from memory).
  it('names each DOMException the report gives', () => {
    expect(nfcProblem(new DOMException('x', 'NotAllowedError'))).toBe('denied');
    expect(nfcProblem(new DOMException('x', 'NotSupportedError'))).toBe('unsupported');
    expect(nfcProblem(new DOMException('x', 'NotReadableError'))).toBe('off');
    expect(nfcProblem(new DOMException('x', 'NetworkError'))).toBe('moved');
    expect(nfcProblem(new DOMException('x', 'AbortError'))).toBe('cancelled');
    expect(nfcProblem(new TypeError('bad message'))).toBe('failed');
    expect(nfcProblem('weird')).toBe('failed');
  });

  it('says what to do, differently for writing and reading', () => {
    expect(nfcProblemWords('denied', 'write').body).toMatch(/site settings.*locked/);
    expect(nfcProblemWords('denied', 'read').title).toBe('Rackside may not use NFC.');
    expect(nfcProblemWords('moved', 'write').title).toBe(
      'The tag moved away before it was written.',
    );
    expect(nfcProblemWords('timeout', 'write').title).toBe('No tag came near the phone.');
    expect(nfcProblemWords('off', 'read').body).toMatch(/Turn NFC on/);
  });
});
