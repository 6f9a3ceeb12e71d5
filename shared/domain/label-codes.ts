/**
 * Label codes are typed by people and printed in QR symbols, so they use upper-case letters and
 * digits from the QR alphanumeric set (ISO/IEC 18004, 7.4.4) minus look-alikes (O/0, I/1).
 */
export const LABEL_ALPHABET = '23456789ABCDEFGHJKLMNPQRSTUVWXYZ';

/** What a person typed or a scan gave, made comparable: upper case, no spaces. */
export function normaliseLabelCode(raw: string): string {
  return raw.toUpperCase().replace(/\s+/g, '');
}

const CODE_PATTERN = new RegExp(`^[${LABEL_ALPHABET}]{2,4}-[${LABEL_ALPHABET}]{3,5}$`);
export function isLabelCode(code: string): boolean {
  return CODE_PATTERN.test(code);
}

/** `count` distinct codes "PREFIX-XXX" from a seeded generator (deterministic for the demo). */
export function generateLabelCodes(prefix: string, count: number, random: () => number, taken = new Set<string>()): string[] {
  const codes: string[] = [];
  while (codes.length < count) {
    let body = '';
    for (let i = 0; i < 3; i++) body += LABEL_ALPHABET[Math.floor(random() * LABEL_ALPHABET.length)];
    const code = `${prefix}-${body}`;
    if (!taken.has(code)) {
      taken.add(code);
      codes.push(code);
    }
  }
  return codes;
}
