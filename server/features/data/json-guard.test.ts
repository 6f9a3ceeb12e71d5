import { describe, expect, it } from 'vitest';
import { HttpError } from '../../middleware/errors';
import { createJsonGuard } from './json-guard';

const limits = { maxBytes: 1000, maxString: 10, maxDepth: 3 };
/** Feeds the text in chunks of `size` bytes; the refusal, if any. */
function refusal(text: string, size = 3): HttpError | null {
  const check = createJsonGuard(limits);
  const bytes = Buffer.from(text);
  try {
    for (let i = 0; i < bytes.length; i += size) check(bytes.subarray(i, i + size));
    return null;
  } catch (err) {
    return err as HttpError;
  }
}

describe('the JSON guard in front of the streaming parser', () => {
  it('lets a file within the limits through, strings split across chunks and escapes included', () => {
    expect(refusal('{"a":["0123456789",{"b":"x\\"y\\\\"}],"n":-12.5e3,"t":true}', 1)).toBeNull();
    // Brackets and quotes inside strings are text, not structure.
    expect(refusal('{"a":"[[[[{{{"}')).toBeNull();
  });

  it('refuses a string longer than the limit, however it is cut', () => {
    for (const size of [1, 4, 64])
      expect(refusal('{"a":"01234567890"}', size)).toMatchObject({ status: 422, code: 'invalid' });
    // An escaped quote does not end the string.
    expect(refusal('{"a":"0123\\"4567890"}')).toMatchObject({ status: 422 });
  });

  it('refuses nesting deeper than the limit, a runaway number, and a file over the size limit (413)', () => {
    expect(refusal('{"a":[{"b":[]}]}')?.message).toMatch(/nested far deeper/);
    expect(refusal(`{"a":${'9'.repeat(65)}}`, 7)?.message).toMatch(/far longer/);
    expect(refusal(`{"a":"${' '.repeat(8)}"}${' '.repeat(1000)}`)).toMatchObject({
      status: 413,
      message: 'This backup is larger than Rackside restores (1 KB at most).',
    });
  });
});
