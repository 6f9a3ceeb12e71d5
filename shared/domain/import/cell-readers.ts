import {
  ANIMAL_GROUPS,
  GROUP_LABEL,
  GROUP_STAGES,
  LIFE_STAGES,
  STAGE_LABEL,
  type AnimalGroup,
  type LifeStage,
  type Sex,
} from '../animal-facts';
import { presetFor } from '../genus-presets';
import type { LocalDate } from '../local-dates';
import { MM_PER_INCH } from '../units';

/**
 * How one spreadsheet cell is read: the way keepers write things in their own sheets ("F", "5in",
 * `4"`, "03/04/2025"), turned into what the animal form stores. Each reader says in words what it
 * could not read, so the import screen can explain a row without naming a field.
 */
export type CellRead<T> = { ok: true; value: T } | { ok: false; problem: string };

const ok = <T>(value: T): CellRead<T> => ({ ok: true, value });
const no = (problem: string): CellRead<never> => ({ ok: false, problem });

/** Lower case, one space between words, no emoji variation selector (♀️ is ♀ + U+FE0F). */
function words(cell: string): string {
  return cell
    .replace(/\uFE0F/g, '')
    .trim()
    .toLowerCase()
    .replace(/[\s_]+/g, ' ');
}

// Sex. "1.0", "0.1" and "0.0.1" count males, females and unsexed animals, in that order: a keepers'
// and breeders' shorthand (common practice, no published source). A "?" after a sex ("F?") is a
// guess, which is not a sex we record: the animal stays unknown until it is sexed.
const SEX_WORDS: Record<string, Sex> = {
  '': 'unknown',
  '?': 'unknown',
  '??': 'unknown',
  '-': 'unknown',
  '–': 'unknown',
  '—': 'unknown',
  u: 'unknown',
  unk: 'unknown',
  unknown: 'unknown',
  'sex unknown': 'unknown',
  unsexed: 'unknown',
  'un sexed': 'unknown',
  'un-sexed': 'unknown',
  'not sexed': 'unknown',
  'n/a': 'unknown',
  na: 'unknown',
  '0.0.1': 'unknown',
  'f?': 'unknown',
  'female?': 'unknown',
  '♀?': 'unknown',
  'm?': 'unknown',
  'male?': 'unknown',
  '♂?': 'unknown',
  f: 'female',
  fem: 'female',
  female: 'female',
  '♀': 'female',
  '0.1': 'female',
  '0.1.0': 'female',
  m: 'male',
  male: 'male',
  '♂': 'male',
  '1.0': 'male',
  '1.0.0': 'male',
  mm: 'mature_male',
  'mature male': 'mature_male',
  'male mature': 'mature_male',
  'adult male': 'mature_male',
};

export function readSex(cell: string): CellRead<Sex> {
  const sex = SEX_WORDS[words(cell)];
  return sex
    ? ok(sex)
    : no(`“${cell.trim()}” is not a sex we know: write F, M, MM (mature male) or unsexed.`);
}

// Sizes. 1 in = 25.4 mm exactly, as MM_PER_INCH says (international yard and pound agreement of
// 1959; NIST Special Publication 811, 2008 edition, Appendix B.8 "inch … 2.54 cm" — from memory).
export const SIZE_INPUT_UNITS = ['mm', 'cm', 'in'] as const;
export type SizeInputUnit = (typeof SIZE_INPUT_UNITS)[number];
const MM_PER: Record<SizeInputUnit, number> = { mm: 1, cm: 10, in: MM_PER_INCH };
export const SIZE_UNIT_LABEL: Record<SizeInputUnit, string> = {
  mm: 'mm',
  cm: 'cm',
  in: 'inches',
};

const UNIT_WORDS: Record<string, SizeInputUnit> = {
  mm: 'mm',
  millimetre: 'mm',
  millimetres: 'mm',
  millimeter: 'mm',
  millimeters: 'mm',
  cm: 'cm',
  centimetre: 'cm',
  centimetres: 'cm',
  centimeter: 'cm',
  centimeters: 'cm',
  in: 'in',
  'in.': 'in',
  inch: 'in',
  inches: 'in',
  '"': 'in',
  '”': 'in',
  '″': 'in',
  "''": 'in',
};
const FRACTIONS: Record<string, number> = { '¼': 0.25, '½': 0.5, '¾': 0.75 };

/** "2", "2.5", "2,5", "2 1/2", "1/2", "2½" as a number; null when it is none of those. */
function amount(text: string): number | null {
  const t = text.trim();
  let m = /^(\d+)?\s*([¼½¾])$/.exec(t);
  if (m) return Number(m[1] ?? 0) + FRACTIONS[m[2]!]!;
  m = /^(?:(\d+)\s+)?(\d+)\/(\d+)$/.exec(t);
  if (m) return Number(m[3]) === 0 ? null : Number(m[1] ?? 0) + Number(m[2]) / Number(m[3]);
  m = /^\d+(?:[.,]\d+)?$|^[.,]\d+$/.exec(t);
  return m ? Number(t.replace(',', '.')) : null;
}

/** Stored sizes are millimetres to a tenth (units.ts). */
const toTenth = (mm: number) => Math.round(mm * 10) / 10;

/**
 * A size as keepers write it: "5in", `4"`, "2 cm", "45 mm", "2 1/2 in", "3.5", with "DLS" (diagonal
 * leg span) allowed after it. A bare number is in `bareUnit`. Blank is no size.
 */
export function readSize(cell: string, bareUnit: SizeInputUnit): CellRead<number | null> {
  const text = words(cell).replace(/\s*(dls|leg span)$/, '');
  if (text === '') return ok(null);
  const m =
    /^(.*?)\s*(mm|cm|in\.?|inch(?:es)?|millimet(?:re|er)s?|centimet(?:re|er)s?|["”″]|'')$/.exec(
      text,
    );
  const [number, unit] = m ? [m[1]!, UNIT_WORDS[m[2]!]!] : [text, bareUnit];
  if (/\d\s*(-|–|to)\s*\d/.test(number))
    return no(`“${cell.trim()}” is a range: give one size, such as the larger.`);
  const value = amount(number);
  if (value === null)
    return no(`“${cell.trim()}” is not a size we can read: write it like 45 mm, 4.5 cm or 2in.`);
  return ok(toTenth(value * MM_PER[unit]));
}

/** A unit named in a header, as in "Size (in)", "DLS inches" or our own "size_mm". */
export function unitInHeader(header: string): SizeInputUnit | null {
  const tokens = header.toLowerCase().split(/[^a-z"]+/);
  for (const t of tokens) {
    const unit = UNIT_WORDS[t];
    if (unit && t !== 'in') return unit;
  }
  // "in" alone is an ordinary word ("Size in inches" is caught above); only "(in)" names the unit.
  return /\(\s*in\.?\s*\)/i.test(header) ? 'in' : null;
}

// Dates. ISO 8601's year-month-day order is read whatever the separator and padding; day and
// month written as numbers before the year are read in the order the keeper chooses, unless the
// date itself settles it (a number above 12 is a day; the same number twice is either way).
export const DATE_ORDERS = ['day-first', 'month-first'] as const;
export type DateOrder = (typeof DATE_ORDERS)[number];

const MONTH_NAMES = [
  'january',
  'february',
  'march',
  'april',
  'may',
  'june',
  'july',
  'august',
  'september',
  'october',
  'november',
  'december',
];
const monthNamed = (word: string) =>
  word.length >= 3 ? MONTH_NAMES.findIndex((m) => m.startsWith(word)) + 1 : 0;

const pad = (n: number) => String(n).padStart(2, '0');

function calendarDate(cell: string, y: number, m: number, d: number): CellRead<LocalDate> {
  const date = new Date(Date.UTC(y, m - 1, d));
  if (m < 1 || m > 12 || d < 1 || date.getUTCMonth() !== m - 1)
    return no(`“${cell.trim()}” is not a date on the calendar.`);
  if (y < 1900 || y > 2200) return no(`“${cell.trim()}”: give a year between 1900 and 2200.`);
  return ok(`${y}-${pad(m)}-${pad(d)}`);
}

/** Day and month as numbers before the year: which one is which, if the date says so itself. */
export type NumericDate = { first: number; second: number; year: number } | null;
export function numericDate(cell: string): NumericDate {
  const m = /^(\d{1,2})[/.-](\d{1,2})[/.-](\d{4})(?:[ T]\d{1,2}:\d{2}(?::\d{2})?)?$/.exec(
    cell.trim(),
  );
  return m ? { first: Number(m[1]), second: Number(m[2]), year: Number(m[3]) } : null;
}

/** Both readings differ and both are possible: the keeper has to say which order the file uses. */
export function isAmbiguous(d: NonNullable<NumericDate>): boolean {
  return d.first !== d.second && d.first <= 12 && d.second <= 12;
}

/** The date each order makes of it (2025-04-03 and 2025-03-04 for 03/04/2025). */
export function readingsOf(d: NonNullable<NumericDate>): Record<DateOrder, LocalDate> {
  const iso = (day: number, month: number) => `${d.year}-${pad(month)}-${pad(day)}`;
  return { 'day-first': iso(d.first, d.second), 'month-first': iso(d.second, d.first) };
}

/**
 * A date as keepers write it: 2025-04-03, 2025-4-3, 2025/4/3, 03/04/2025 (in `order`), 3 Apr 2025,
 * April 3, 2025. A time after the date is ignored. Blank is no date.
 */
export function readDate(cell: string, order: DateOrder | null): CellRead<LocalDate | null> {
  const text = cell.trim();
  if (text === '') return ok(null);
  let m = /^(\d{4})[-/.](\d{1,2})[-/.](\d{1,2})(?:[ T]\d{1,2}:\d{2}.*)?$/.exec(text);
  if (m) return calendarDate(text, Number(m[1]), Number(m[2]), Number(m[3]));
  const n = numericDate(text);
  if (n) {
    if (n.first > 12 && n.second > 12) return no(`“${text}” is not a date on the calendar.`);
    if (isAmbiguous(n) && !order) {
      return no(`“${text}” could be day first or month first. Choose the date order above.`);
    }
    const dayFirst = n.first > 12 || (n.second <= 12 && order !== 'month-first');
    if (order === 'month-first' && n.first > 12)
      return no(`“${text}” has the day first, but month first is chosen above.`);
    if (order === 'day-first' && n.second > 12)
      return no(`“${text}” has the month first, but day first is chosen above.`);
    return dayFirst
      ? calendarDate(text, n.year, n.second, n.first)
      : calendarDate(text, n.year, n.first, n.second);
  }
  if (/^\d{1,2}[/.-]\d{1,2}[/.-]\d{2}$/.test(text))
    return no(`“${text}”: write the year in full, as in 03/04/2025.`);
  const lower = text.toLowerCase();
  m = /^(\d{1,2})(?:st|nd|rd|th)?[\s-]+([a-z]+)\.?[\s,-]+(\d{4})$/.exec(lower);
  if (m && monthNamed(m[2]!))
    return calendarDate(text, Number(m[3]), monthNamed(m[2]!), Number(m[1]));
  m = /^([a-z]+)\.?\s+(\d{1,2})(?:st|nd|rd|th)?,?\s+(\d{4})$/.exec(lower);
  if (m && monthNamed(m[1]!))
    return calendarDate(text, Number(m[3]), monthNamed(m[1]!), Number(m[2]));
  return no(`“${text}” is not a date we can read: write it like 2025-04-03 or 3 Apr 2025.`);
}

// Groups and stages, by our names, their labels, or a keeper's short form.
const GROUP_WORDS: Record<string, AnimalGroup> = {
  ...Object.fromEntries(ANIMAL_GROUPS.map((g) => [g.replace('_', ' '), g])),
  ...Object.fromEntries(ANIMAL_GROUPS.map((g) => [GROUP_LABEL[g].toLowerCase(), g])),
  ...Object.fromEntries(
    ANIMAL_GROUPS.filter((g) => !g.endsWith('s')).map((g) => [
      `${GROUP_LABEL[g].toLowerCase()}s`,
      g,
    ]),
  ),
  t: 'tarantula',
  spider: 'true_spider',
  spiders: 'true_spider',
  'jumping spider': 'true_spider',
  scorp: 'scorpion',
  pede: 'centipede',
  mantid: 'mantis',
  mantids: 'mantis',
  mantises: 'mantis',
  'praying mantis': 'mantis',
};

export function readGroup(cell: string): CellRead<AnimalGroup | null> {
  const text = words(cell);
  if (text === '') return ok(null);
  const group = GROUP_WORDS[text];
  return group
    ? ok(group)
    : no(
        `“${cell.trim()}” is not a group we know: use ${ANIMAL_GROUPS.map((g) => GROUP_LABEL[g]).join(', ')}.`,
      );
}

/** The group of a genus we know (genus-presets.ts), however the name's first letter is written. */
export function genusGroup(scientificName: string): AnimalGroup | null {
  const name = scientificName.trim();
  return presetFor(name.charAt(0).toUpperCase() + name.slice(1).toLowerCase())?.group ?? null;
}

const STAGE_WORDS: Record<string, LifeStage> = {
  ...Object.fromEntries(LIFE_STAGES.map((s) => [s.replace('_', ' '), s])),
  ...Object.fromEntries(LIFE_STAGES.map((s) => [STAGE_LABEL[s].toLowerCase(), s])),
  ...Object.fromEntries(
    Object.values(GROUP_STAGES).flatMap((names) =>
      Object.entries(names).map(([stage, label]) => [label.toLowerCase(), stage as LifeStage]),
    ),
  ),
  spiderling: 'sling',
  slings: 'sling',
  juv: 'juvenile',
  juvie: 'juvenile',
  juvi: 'juvenile',
  'sub adult': 'subadult',
  'sub-adult': 'subadult',
  sa: 'subadult',
  mature: 'adult',
};

export function readStage(cell: string): CellRead<LifeStage | null> {
  const text = words(cell);
  if (text === '') return ok(null);
  const stage = STAGE_WORDS[text];
  return stage
    ? ok(stage)
    : no(`“${cell.trim()}” is not a life stage we know: use sling, juvenile, subadult or adult.`);
}

/** Yes for y, yes, true, 1, x or ✓; anything else (blank included) is no. */
export function readYes(cell: string): boolean {
  return /^(y|yes|true|1|x|✓|✔)$/i.test(cell.trim());
}

/** A number of days or prey: blank is none. */
export function readNumber(cell: string): CellRead<number | null> {
  const text = cell.trim();
  if (text === '') return ok(null);
  const value = amount(text);
  return value === null ? no(`“${text}” is not a number.`) : ok(value);
}
