import { TZDate, tz } from '@date-fns/tz';
import { format } from 'date-fns';

/**
 * A round belongs to a calendar date in the collection's IANA zone. Calendar dates are kept as
 * "YYYY-MM-DD" strings and counted in whole days without any clock; instants are Dates.
 */
export type LocalDate = string;

const DAY_MS = 86_400_000;

function parts(date: LocalDate): [number, number, number] {
  const [y, m, d] = date.split('-').map(Number);
  return [y!, m!, d!];
}

/** The calendar date an instant falls on in `zone`. */
export function localDateOf(instant: Date, zone: string): LocalDate {
  return format(instant, 'yyyy-MM-dd', { in: tz(zone) });
}

/** The instant a local calendar date begins in `zone` (handles DST: not always 00:00 UTC±n). */
export function startOfLocalDate(date: LocalDate, zone: string): Date {
  const [y, m, d] = parts(date);
  return new Date(new TZDate(y, m - 1, d, zone).getTime());
}

/** The calendar date `days` after `date` (negative goes back). Pure calendar arithmetic. */
export function addDays(date: LocalDate, days: number): LocalDate {
  const [y, m, d] = parts(date);
  return new Date(Date.UTC(y, m - 1, d) + days * DAY_MS).toISOString().slice(0, 10);
}

/** Whole calendar days from `from` to `to` (positive when `to` is later). */
export function daysBetween(from: LocalDate, to: LocalDate): number {
  const [y1, m1, d1] = parts(from);
  const [y2, m2, d2] = parts(to);
  return Math.round((Date.UTC(y2, m2 - 1, d2) - Date.UTC(y1, m1 - 1, d1)) / DAY_MS);
}

const WEEKDAYS = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'];
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** "Fri 11 Dec" (or "Fri 11 Dec 2026") — for sentences; the same on every runtime. */
export function describeLocalDate(date: LocalDate, withYear = false): string {
  const [y, m, d] = parts(date);
  const weekday = WEEKDAYS[new Date(Date.UTC(y, m - 1, d)).getUTCDay()];
  return `${weekday} ${d} ${MONTHS[m - 1]}${withYear ? ` ${y}` : ''}`;
}
