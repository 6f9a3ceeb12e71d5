import { TZDate } from '@date-fns/tz';

/**
 * A round belongs to a calendar date in the collection's IANA zone. Calendar dates are kept as
 * "YYYY-MM-DD" strings and counted in whole days without any clock; instants are Dates.
 */
export type LocalDate = string;

const DAY_MS = 86_400_000;

function parts(date: LocalDate): [number, number, number] {
  return [Number(date.slice(0, 4)), Number(date.slice(5, 7)), Number(date.slice(8, 10))];
}

// Day arithmetic runs millions of times when a large collection's round is built: dates are
// mapped to day numbers (days since 1970-01-01) once and remembered. Bounded caches.
const dayNumbers = new Map<string, number>();
const dayStrings = new Map<number, string>();
function dayNumber(date: LocalDate): number {
  let n = dayNumbers.get(date);
  if (n === undefined) {
    const [y, m, d] = parts(date);
    n = Math.round(Date.UTC(y, m - 1, d) / DAY_MS);
    if (dayNumbers.size > 50_000) dayNumbers.clear();
    dayNumbers.set(date, n);
  }
  return n;
}
function fromDayNumber(n: number): LocalDate {
  let s = dayStrings.get(n);
  if (s === undefined) {
    s = new Date(n * DAY_MS).toISOString().slice(0, 10);
    if (dayStrings.size > 50_000) dayStrings.clear();
    dayStrings.set(n, s);
  }
  return s;
}

// One formatter per zone: building an Intl.DateTimeFormat is the expensive part.
const formatters = new Map<string, Intl.DateTimeFormat>();

function formattedDate(instant: Date | number, zone: string): LocalDate {
  let f = formatters.get(zone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-CA', {
      timeZone: zone,
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
    });
    formatters.set(zone, f);
  }
  const parts = f.formatToParts(instant);
  const get = (type: string) => parts.find((p) => p.type === type)!.value;
  return `${get('year')}-${get('month')}-${get('day')}`;
}

// Folding an animal's log asks for the date of every event, again at each sync (P5), and Intl
// is the slow part. Zones' offsets and their changes fall on whole quarter hours, so an
// instant's date is its UTC quarter hour's: remembered per zone once the quarter's first and
// last millisecond agree (an odd old offset then still gets the exact answer). Bounded.
const QUARTER_MS = 900_000;
const quarterDates = new Map<string, Map<number, LocalDate>>();
let rememberedQuarters = 0;

/** The calendar date an instant falls on in `zone`. */
export function localDateOf(instant: Date, zone: string): LocalDate {
  const quarter = Math.floor(instant.getTime() / QUARTER_MS);
  let dates = quarterDates.get(zone);
  const known = dates?.get(quarter);
  if (known !== undefined) return known;
  const first = formattedDate(quarter * QUARTER_MS, zone);
  if (first !== formattedDate(quarter * QUARTER_MS + QUARTER_MS - 1, zone))
    return formattedDate(instant, zone);
  if (rememberedQuarters >= 100_000) {
    quarterDates.clear();
    rememberedQuarters = 0;
  }
  if (!dates) quarterDates.set(zone, (dates = new Map()));
  dates.set(quarter, first);
  rememberedQuarters++;
  return first;
}

/** The instant a local calendar date begins in `zone` (handles DST: not always 00:00 UTC±n). */
export function startOfLocalDate(date: LocalDate, zone: string): Date {
  const [y, m, d] = parts(date);
  return new Date(new TZDate(y, m - 1, d, zone).getTime());
}

/** The calendar date `days` after `date` (negative goes back). Pure calendar arithmetic. */
export function addDays(date: LocalDate, days: number): LocalDate {
  return fromDayNumber(dayNumber(date) + days);
}

/** Whole calendar days from `from` to `to` (positive when `to` is later). */
export function daysBetween(from: LocalDate, to: LocalDate): number {
  return dayNumber(to) - dayNumber(from);
}

/** ISO 8601 weekday: 1 for Monday … 7 for Sunday (ISO 8601-1:2019, 3.1.2.6 — from memory). */
export function dayOfWeek(date: LocalDate): number {
  // 1970-01-01 (day 0) was a Thursday, ISO weekday 4.
  return ((((dayNumber(date) + 3) % 7) + 7) % 7) + 1;
}

const WEEKDAYS = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'];
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** "Fri 11 Dec" (or "Fri 11 Dec 2026") — for sentences; the same on every runtime. */
export function describeLocalDate(date: LocalDate, withYear = false): string {
  const [y, m, d] = parts(date);
  const weekday = WEEKDAYS[new Date(Date.UTC(y, m - 1, d)).getUTCDay()];
  return `${weekday} ${d} ${MONTHS[m - 1]}${withYear ? ` ${y}` : ''}`;
}

const clockFormats = new Map<string, Intl.DateTimeFormat>();
/** An instant as 24-hour local time in the zone, e.g. "08:40". */
export function clockTime(iso: string, zone: string): string {
  let f = clockFormats.get(zone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-GB', {
      hour: '2-digit',
      minute: '2-digit',
      hourCycle: 'h23',
      timeZone: zone,
    });
    clockFormats.set(zone, f);
  }
  return f.format(new Date(iso));
}

const instantFormats = new Map<string, Intl.DateTimeFormat>();
/** An instant as "Tue 1 Dec, 08:40" in the zone (the device's own when none is given). */
export function describeInstant(iso: string, zone?: string): string {
  const key = zone ?? '';
  let f = instantFormats.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat('en-GB', {
      weekday: 'short',
      day: 'numeric',
      month: 'short',
      hour: '2-digit',
      minute: '2-digit',
      hourCycle: 'h23',
      timeZone: zone,
    });
    instantFormats.set(key, f);
  }
  return f.format(new Date(iso));
}

/**
 * The instant to record for a date the keeper gives ("pulled on 3 Mar"): the moment of typing
 * when it is today there, else noon that day in the zone — mid-day, so the fact falls on that
 * date whatever the daylight-saving change, and after anything done that morning.
 */
export function instantOfKeeperDate(date: LocalDate, zone: string, now: Date): Date {
  if (localDateOf(now, zone) === date) return now;
  const [y, m, d] = parts(date);
  return new Date(new TZDate(y, m - 1, d, 12, 0, 0, zone).getTime());
}
