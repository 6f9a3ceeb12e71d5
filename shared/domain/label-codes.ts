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
export function generateLabelCodes(
  prefix: string,
  count: number,
  random: () => number,
  taken = new Set<string>(),
): string[] {
  const codes: string[] = [];
  while (codes.length < count) {
    let body = '';
    for (let i = 0; i < 3; i++)
      body += LABEL_ALPHABET[Math.floor(random() * LABEL_ALPHABET.length)];
    const code = `${prefix}-${body}`;
    if (!taken.has(code)) {
      taken.add(code);
      codes.push(code);
    }
  }
  return codes;
}

/**
 * The prefix for a collection's new codes: the one its codes already use most, else the
 * initials of its name, then its other letters, from the label alphabet ("Kim’s spiders" → "KS").
 */
export function collectionPrefix(collectionName: string, existingCodes: readonly string[]): string {
  const counts = new Map<string, number>();
  for (const code of existingCodes) {
    const prefix = code.split('-')[0]!;
    counts.set(prefix, (counts.get(prefix) ?? 0) + 1);
  }
  const common = [...counts.entries()].sort((a, b) => b[1] - a[1])[0];
  if (common && isLabelCode(`${common[0]}-222`)) return common[0];
  const letters = normaliseLabelCode(
    collectionName.normalize('NFD').replace(/[^A-Za-z0-9\s]/g, ''),
  );
  const initials = collectionName
    .split(/\s+/)
    .map((w) => normaliseLabelCode(w.normalize('NFD').replace(/[^A-Za-z0-9]/g, '')).charAt(0))
    .join('');
  const usable = [...initials, ...letters].filter((c) => LABEL_ALPHABET.includes(c));
  return [...new Set(usable)].slice(0, 2).join('').padEnd(2, 'X');
}
