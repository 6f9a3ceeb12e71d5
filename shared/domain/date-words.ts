import type { LocalDate } from './local-dates';

/**
 * Calendar dates and instants as people read them, in their own locale ("Wed 2 Dec 2026" in
 * en-GB, "Wed, Dec 2, 2026" in en-US, "Mi., 2. Dez. 2026" in German). Screens pass no locale:
 * Intl then uses the browser's own language (ECMA-402, 9.2 "Locale and Parameter Negotiation":
 * an undefined locale list means the implementation's default locale).
 *
 * Calendar dates ("YYYY-MM-DD") carry no clock, so they are formatted at noon UTC in UTC: no
 * time zone can move them to the day before or after.
 */
export type Locales = string | readonly string[] | undefined;

export interface DateWordsOptions {
  /** The short weekday ("Wed"). On by default: keepers plan by weekday. */
  weekday?: boolean;
  /** The year: always, never, or (the default) only when it is not the current one. */
  year?: 'always' | 'never' | 'auto';
  /** Today, to decide the year in "auto" mode (defaults to the runtime's clock). */
  today?: LocalDate;
}

const formats = new Map<string, Intl.DateTimeFormat>();
function formatFor(locales: Locales, weekday: boolean, year: boolean): Intl.DateTimeFormat {
  const key = `${JSON.stringify(locales ?? null)}|${weekday}|${year}`;
  let f = formats.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat(locales as string | string[] | undefined, {
      weekday: weekday ? 'short' : undefined,
      day: 'numeric',
      month: 'short',
      year: year ? 'numeric' : undefined,
      timeZone: 'UTC',
    });
    formats.set(key, f);
  }
  return f;
}

const noonUtc = (date: LocalDate) =>
  new Date(
    Date.UTC(Number(date.slice(0, 4)), Number(date.slice(5, 7)) - 1, Number(date.slice(8, 10)), 12),
  );

const thisYear = (today?: LocalDate) => today?.slice(0, 4) ?? String(new Date().getFullYear());

/** One calendar date: "Wed 2 Dec" (this year) or "Wed 2 Dec 2025", in the person's locale. */
export function formatLocalDate(
  date: LocalDate,
  locales?: Locales,
  options: DateWordsOptions = {},
): string {
  const year =
    options.year === 'always' ||
    (options.year !== 'never' && date.slice(0, 4) !== thisYear(options.today));
  return formatFor(locales, options.weekday ?? true, year).format(noonUtc(date));
}

/**
 * Two calendar dates as a span: "from Wed 2 Dec to Thu 10 Dec 2026". The year is written once,
 * at the end, unless the two dates fall in different years (then both carry it).
 */
export function formatDateRange(
  from: LocalDate,
  to: LocalDate,
  locales?: Locales,
  options: Pick<DateWordsOptions, 'weekday'> = {},
): string {
  const sameYear = from.slice(0, 4) === to.slice(0, 4);
  const first = formatLocalDate(from, locales, { ...options, year: sameYear ? 'never' : 'always' });
  const last = formatLocalDate(to, locales, { ...options, year: 'always' });
  return `from ${first} to ${last}`;
}

const instantFormats = new Map<string, Intl.DateTimeFormat>();
/** An instant as date and clock time in the collection's zone, in the person's locale. */
export function formatInstant(iso: string | Date, zone: string, locales?: Locales): string {
  const key = `${JSON.stringify(locales ?? null)}|${zone}`;
  let f = instantFormats.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat(locales as string | string[] | undefined, {
      weekday: 'short',
      day: 'numeric',
      month: 'short',
      year: 'numeric',
      hour: 'numeric',
      minute: '2-digit',
      timeZone: zone,
    });
    instantFormats.set(key, f);
  }
  return f.format(typeof iso === 'string' ? new Date(iso) : iso);
}

/** A phrase that opens a sentence or a line ("From Wed 2 Dec…"). */
export const capitalised = (phrase: string) => phrase.charAt(0).toUpperCase() + phrase.slice(1);
