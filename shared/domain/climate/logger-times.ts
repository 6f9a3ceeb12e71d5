/**
 * A data logger writes its clock's local time without an offset. Turning that into an instant
 * needs the logger's IANA zone and its rules (IANA Time Zone Database, tzdata; e.g. the
 * Europe/Amsterdam rule "EU" moves clocks forward at 01:00 UTC on the last Sunday of March and
 * back at 01:00 UTC on the last Sunday of October). Two local hours are special:
 *
 * - In autumn one local hour happens twice (02:00–02:59 in Amsterdam on 2026-10-25, first at
 *   +02:00 and then at +01:00): such a time is *ambiguous*. We read it with the order of the
 *   file's rows — a logger writes in time order — taking the earlier instant unless that would
 *   go back before the previous row's instant, then the later one.
 * - In spring one local hour never happens (02:00–02:59 in Amsterdam on 2026-03-29): such a
 *   time does not exist, and the row is refused with its line number rather than guessed.
 *
 * A cell that carries its own offset ("…+01:00" or "…Z") is taken as written.
 */

export interface WallTime {
  year: number;
  month: number;
  day: number;
  hour: number;
  minute: number;
  second: number;
}

export type ParsedTime =
  { kind: 'wall'; wall: WallTime } | { kind: 'instant'; instant: Date } | { kind: 'invalid' };

const ISO =
  /^(\d{4})[-/](\d{1,2})[-/](\d{1,2})[T ](\d{1,2}):(\d{2})(?::(\d{2})(?:[.,]\d+)?)?\s*(Z|[+-]\d{2}:?\d{2})?$/i;
const DOTTED = /^(\d{1,2})\.(\d{1,2})\.(\d{4})[ T](\d{1,2}):(\d{2})(?::(\d{2}))?$/;

function validWall(w: WallTime): boolean {
  if (w.month < 1 || w.month > 12 || w.day < 1 || w.hour > 23 || w.minute > 59 || w.second > 59)
    return false;
  const days = new Date(Date.UTC(w.year, w.month, 0)).getUTCDate();
  return w.day <= days;
}

/** Reads "2026-10-25 02:30", "2026-10-25T02:30:00", "2026/10/25 2:30", "25.10.2026 02:30" and ISO with an offset. */
export function parseLoggerTime(cell: string): ParsedTime {
  const text = cell.trim();
  const iso = ISO.exec(text);
  const dotted = iso ? null : DOTTED.exec(text);
  if (!iso && !dotted) return { kind: 'invalid' };
  const n = (s: string | undefined) => (s === undefined ? 0 : Number(s));
  const wall: WallTime = iso
    ? {
        year: n(iso[1]),
        month: n(iso[2]),
        day: n(iso[3]),
        hour: n(iso[4]),
        minute: n(iso[5]),
        second: n(iso[6]),
      }
    : {
        year: n(dotted![3]),
        month: n(dotted![2]),
        day: n(dotted![1]),
        hour: n(dotted![4]),
        minute: n(dotted![5]),
        second: n(dotted![6]),
      };
  if (!validWall(wall)) return { kind: 'invalid' };
  const offset = iso?.[7];
  if (offset) {
    const asUtc = wallMs(wall);
    if (offset.toUpperCase() === 'Z') return { kind: 'instant', instant: new Date(asUtc) };
    const sign = offset.startsWith('-') ? -1 : 1;
    const digits = offset.slice(1).replace(':', '');
    const minutes = Number(digits.slice(0, 2)) * 60 + Number(digits.slice(2));
    return { kind: 'instant', instant: new Date(asUtc - sign * minutes * 60_000) };
  }
  return { kind: 'wall', wall };
}

const wallMs = (w: WallTime) => Date.UTC(w.year, w.month - 1, w.day, w.hour, w.minute, w.second);

const formatters = new Map<string, Intl.DateTimeFormat>();
/** The wall clock in `zone` at `instant`, as if it were UTC milliseconds. */
function wallOf(instant: number, zone: string): number {
  let f = formatters.get(zone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', {
      timeZone: zone,
      hourCycle: 'h23',
      year: 'numeric',
      month: 'numeric',
      day: 'numeric',
      hour: 'numeric',
      minute: 'numeric',
      second: 'numeric',
    });
    formatters.set(zone, f);
  }
  const p: Record<string, number> = {};
  for (const part of f.formatToParts(new Date(instant))) p[part.type] = Number(part.value);
  return Date.UTC(p.year!, p.month! - 1, p.day!, p.hour!, p.minute!, p.second!);
}

/**
 * Every instant at which the zone's clocks showed this wall time, earliest first: one
 * normally, two in the repeated autumn hour, none in the skipped spring hour.
 */
export function instantsOfWallTime(wall: WallTime, zone: string): Date[] {
  const w = wallMs(wall);
  // Offsets in force a day and a half either side cover any single change of the clocks.
  const offsets = new Set(
    [w - 129_600_000, w, w + 129_600_000].map((probe) => wallOf(probe, zone) - probe),
  );
  const found = new Set<number>();
  for (const offset of offsets) {
    const candidate = w - offset;
    if (wallOf(candidate, zone) === w) found.add(candidate);
  }
  return [...found].sort((a, b) => a - b).map((ms) => new Date(ms));
}

export type ResolvedTime =
  | { ok: true; instant: Date; ambiguous: boolean }
  | { ok: false; reason: 'invalid' | 'nonexistent' };

/**
 * A logger's cell as an instant, `previous` being the instant of the row before it in the
 * file (null for the first row): see the rules at the top of this file.
 */
export function resolveLoggerTime(cell: string, zone: string, previous: Date | null): ResolvedTime {
  const parsed = parseLoggerTime(cell);
  if (parsed.kind === 'invalid') return { ok: false, reason: 'invalid' };
  if (parsed.kind === 'instant') return { ok: true, instant: parsed.instant, ambiguous: false };
  const instants = instantsOfWallTime(parsed.wall, zone);
  if (instants.length === 0) return { ok: false, reason: 'nonexistent' };
  if (instants.length === 1) return { ok: true, instant: instants[0]!, ambiguous: false };
  const [first, second] = instants as [Date, Date];
  const instant = previous && first.getTime() <= previous.getTime() ? second : first;
  return { ok: true, instant, ambiguous: true };
}
