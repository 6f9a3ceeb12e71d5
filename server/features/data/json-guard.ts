import { HttpError } from '../../middleware/errors';

export interface JsonLimits {
  /** The whole document, in bytes. */
  maxBytes: number;
  /** One string, in bytes between its quotes (a photo's base64 is the longest we write). */
  maxString: number;
  /** Objects and arrays inside each other. */
  maxDepth: number;
}

const QUOTE = 0x22;
const BACKSLASH = 0x5c;
/** A number, true, false or null is never longer than this in a file we wrote. */
const MAX_SCALAR = 64;

export const tooLarge = (maxBytes: number) =>
  new HttpError(
    413,
    'too_large',
    `This backup is larger than Rackside restores (${maxBytes >= 1024 * 1024 ? `${Math.round(maxBytes / 1024 / 1024)} MB` : `${Math.ceil(maxBytes / 1024)} KB`} at most).`,
  );

const notABackup = (why: string) =>
  new HttpError(422, 'invalid', `This file is not a Rackside backup: ${why}`);

/**
 * Watches a JSON byte stream chunk by chunk, before a streaming parser sees it, and refuses it
 * as soon as it breaks a limit: a streaming parser keeps the value it is reading whole, so one
 * giant string or number would otherwise cost memory without bound. Not a validator: a file
 * that passes may still be invalid JSON, which the parser reports.
 */
export function createJsonGuard(limits: JsonLimits) {
  let bytes = 0;
  let inString = false;
  let escaped = false;
  let stringBytes = 0;
  let depth = 0;
  let scalar = 0;

  return function check(chunk: Uint8Array) {
    bytes += chunk.length;
    if (bytes > limits.maxBytes) throw tooLarge(limits.maxBytes);
    for (let i = 0; i < chunk.length; i++) {
      if (inString) {
        if (escaped) {
          escaped = false;
          stringBytes++;
          continue;
        }
        // Long strings (photos) are skipped to their next quote or backslash in one step.
        const quote = chunk.indexOf(QUOTE, i);
        const slash = chunk.indexOf(BACKSLASH, i);
        const next = quote === -1 ? slash : slash === -1 ? quote : Math.min(quote, slash);
        const end = next === -1 ? chunk.length : next;
        stringBytes += end - i;
        if (stringBytes > limits.maxString)
          throw notABackup('one of its values is far longer than anything a backup holds.');
        if (next === -1) break;
        i = next;
        if (chunk[i] === QUOTE) inString = false;
        else escaped = true;
        continue;
      }
      const b = chunk[i]!;
      if (b === QUOTE) {
        inString = true;
        stringBytes = 0;
        scalar = 0;
      } else if (b === 0x7b || b === 0x5b) {
        scalar = 0;
        if (++depth > limits.maxDepth)
          throw notABackup('its values are nested far deeper than a backup’s.');
      } else if (b === 0x7d || b === 0x5d) {
        scalar = 0;
        depth--;
      } else if (b === 0x2c || b === 0x3a || b === 0x20 || b === 0x0a || b === 0x0d || b === 0x09) {
        scalar = 0;
      } else if (++scalar > MAX_SCALAR) {
        throw notABackup('one of its values is far longer than anything a backup holds.');
      }
    }
  };
}
