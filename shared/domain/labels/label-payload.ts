import { LABEL_ALPHABET, normaliseLabelCode } from '../label-codes';

/**
 * What a label's QR holds: a URL into the app, `<ORIGIN>/L/<TAG>/<CODE>`, all in upper case so
 * the whole payload stays in the QR alphanumeric set (ISO/IEC 18004, 7.4.4: 0–9 A–Z space
 * $ % * + - . / :), which packs 5.5 bits a character against 8 in byte mode and keeps the
 * symbol small. Scheme and host are case-insensitive (RFC 3986, 3.1 and 3.2.2); the app's
 * route matches the path in any case.
 *
 * The tag names the collection (codes are unique only inside one), so a label from another
 * collection is told apart from an unknown code.
 */
export const LABEL_TAG_LENGTH = 4;
const TAG_PATTERN = new RegExp(`^[${LABEL_ALPHABET}]{${LABEL_TAG_LENGTH}}$`);

export function isLabelTag(tag: string): boolean {
  return TAG_PATTERN.test(tag);
}

/** A new collection tag from a random source (collisions are retried by the database). */
export function generateLabelTag(random: () => number): string {
  let tag = '';
  for (let i = 0; i < LABEL_TAG_LENGTH; i++)
    tag += LABEL_ALPHABET[Math.floor(random() * LABEL_ALPHABET.length)];
  return tag;
}

/** The app's address as it goes into a QR: upper case, no trailing slash. */
export function labelOrigin(origin: string): string {
  return origin.replace(/\/+$/, '').toUpperCase();
}

export function labelUrl(origin: string, tag: string, code: string): string {
  return `${labelOrigin(origin)}/L/${tag}/${code}`;
}

/**
 * What a QR holds where a whole address does not fit (19 mm squares): `L/<TAG>/<CODE>`, at most
 * 17 characters of the alphanumeric set, so a version 1 symbol (21 modules) holds it at level M
 * (ISO/IEC 18004:2015, Table 7: 20 alphanumeric characters). Rackside's own scanner reads it as
 * a label; a phone's own camera app shows it as text only, as there is no address to open.
 */
export function shortLabelPayload(tag: string, code: string): string {
  return `L/${tag}/${code}`;
}
const SHORT_PAYLOAD = /^L\/([^/\s]+)\/([^/\s]+)$/i;

/** The app route a label URL opens (also the path a phone's own camera app lands on). */
export const labelRoute = (tag: string, code: string) => `/l/${tag}/${code}`;

/** Compares codes as people type them: case, spaces and the dash do not matter. */
export const codeKey = (code: string) => normaliseLabelCode(code).replace(/-/g, '');

export type LabelReading =
  /** One of ours: a collection tag and a code. */
  | { kind: 'label'; tag: string; code: string }
  /** A typed code, which only makes sense in the collection at hand. */
  | { kind: 'code'; code: string }
  /** Our label shape, but its parts are not valid codes (damaged or hand-edited). */
  | { kind: 'malformed' }
  /** Some other QR: a web address or text that is not a Rackside label. */
  | { kind: 'foreign' };

const LABEL_PATH = /^\/L\/([^/]+)\/([^/]+)\/?$/i;
const CODE_CHARS = new RegExp(`^[${LABEL_ALPHABET}-]+$`);
const CODE_LIKE = /^[A-Z0-9]{1,6}-?[A-Z0-9]{1,8}$/;

/** A typed code: 5 to 10 characters of the label alphabet with at most one dash. */
function readCode(text: string): LabelReading {
  const code = normaliseLabelCode(text);
  const bare = code.replace(/-/g, '');
  if (CODE_CHARS.test(code) && code.split('-').length <= 2 && bare.length >= 5 && bare.length <= 9)
    return { kind: 'code', code };
  return CODE_LIKE.test(code) ? { kind: 'malformed' } : { kind: 'foreign' };
}

/** What a scanned QR or a typed string says, before anything is looked up. */
export function readLabel(raw: string): LabelReading {
  const text = raw.trim();
  if (!text) return { kind: 'malformed' };
  const short = SHORT_PAYLOAD.exec(text);
  if (short) {
    const tag = normaliseLabelCode(short[1]!);
    const code = readCode(short[2]!);
    return isLabelTag(tag) && code.kind === 'code'
      ? { kind: 'label', tag, code: code.code }
      : { kind: 'malformed' };
  }
  if (!/^[a-z][a-z0-9+.-]*:\/\//i.test(text)) return readCode(text);
  let url: URL;
  try {
    url = new URL(text);
  } catch {
    return { kind: 'foreign' };
  }
  const match = LABEL_PATH.exec(url.pathname);
  if (!match) return { kind: 'foreign' };
  const tag = normaliseLabelCode(decodeURIComponent(match[1]!));
  const code = readCode(decodeURIComponent(match[2]!));
  return isLabelTag(tag) && code.kind === 'code'
    ? { kind: 'label', tag, code: code.code }
    : { kind: 'malformed' };
}
