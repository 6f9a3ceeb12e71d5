import { localDateOf, type LocalDate } from '../local-dates';
import { formatHumidity, formatTemperature, type TemperatureUnit } from '../temperature';
import { breachesOf, describeBreach, type ReadingValues, type RoomTargets } from './ranges';

export interface TimedReading extends ReadingValues {
  takenAt: string;
}

/** One room's day: the lowest and highest of every reading taken that local day. */
export interface DaySummary {
  date: LocalDate;
  lowCelsius: number | null;
  highCelsius: number | null;
  lowHumidity: number | null;
  highHumidity: number | null;
  readings: number;
}

const lower = (a: number | null, b: number | null) =>
  a === null ? b : b === null ? a : Math.min(a, b);
const higher = (a: number | null, b: number | null) =>
  a === null ? b : b === null ? a : Math.max(a, b);

/**
 * Readings summed up per local day in `zone` (a logger's hundreds of rows become one line on
 * an animal's timeline), oldest day first.
 */
export function summariseByDay(readings: readonly TimedReading[], zone: string): DaySummary[] {
  const days = new Map<LocalDate, DaySummary>();
  for (const r of readings) {
    const date = localDateOf(new Date(r.takenAt), zone);
    const d = days.get(date) ?? {
      date,
      lowCelsius: null,
      highCelsius: null,
      lowHumidity: null,
      highHumidity: null,
      readings: 0,
    };
    for (const t of [r.minCelsius, r.currentCelsius, r.maxCelsius]) {
      d.lowCelsius = lower(d.lowCelsius, t);
      d.highCelsius = higher(d.highCelsius, t);
    }
    d.lowHumidity = lower(d.lowHumidity, r.humidity);
    d.highHumidity = higher(d.highHumidity, r.humidity);
    d.readings += 1;
    days.set(date, d);
  }
  return [...days.values()].sort((a, b) => a.date.localeCompare(b.date));
}

/** True when any of the day's lowest or highest values lies beyond the room's range. */
export function dayOutOfRange(d: DaySummary, t: RoomTargets): boolean {
  const at = (humidity: number | null) => ({
    currentCelsius: null,
    minCelsius: d.lowCelsius,
    maxCelsius: d.highCelsius,
    humidity,
  });
  return (
    breachesOf(at(d.lowHumidity), t).length > 0 || breachesOf(at(d.highHumidity), t).length > 0
  );
}

/** A day in words: "21.5–27.0 °C · 62–75 %". */
export function describeDay(d: DaySummary, unit: TemperatureUnit, locale?: string): string {
  const parts: string[] = [];
  if (d.lowCelsius !== null && d.highCelsius !== null)
    parts.push(
      d.lowCelsius === d.highCelsius
        ? formatTemperature(d.lowCelsius, unit, locale)
        : `${formatTemperature(d.lowCelsius, unit, locale).split(' ')[0]}–${formatTemperature(d.highCelsius, unit, locale)}`,
    );
  if (d.lowHumidity !== null && d.highHumidity !== null)
    parts.push(
      d.lowHumidity === d.highHumidity
        ? formatHumidity(d.lowHumidity, locale)
        : `${formatHumidity(d.lowHumidity, locale).split(' ')[0]}–${formatHumidity(d.highHumidity, locale)}`,
    );
  return parts.join(' · ');
}

/** A room whose readings left its range, with the worst value on each side. */
export interface RoomAlert {
  room: string;
  targets: RoomTargets;
  /** The reading furthest beyond each broken bound, at most one per measure and side. */
  breaches: (ReturnType<typeof breachesOf>[number] & { takenAt: string })[];
}

/**
 * The rooms whose readings left their range, each breach kept once at its worst (a logger
 * above 28 °C all afternoon is one line, at its peak). Rooms in name order.
 */
export function roomAlerts(
  rooms: readonly { room: string; targets: RoomTargets; readings: readonly TimedReading[] }[],
): RoomAlert[] {
  const out: RoomAlert[] = [];
  for (const { room, targets, readings } of rooms) {
    const worst = new Map<string, RoomAlert['breaches'][number]>();
    for (const r of readings) {
      for (const b of breachesOf(r, targets)) {
        const key = `${b.measure}:${b.side}`;
        const prev = worst.get(key);
        const further = (x: number, y: number) => (b.side === 'high' ? x > y : x < y);
        if (!prev || further(b.value, prev.value)) worst.set(key, { ...b, takenAt: r.takenAt });
      }
    }
    if (worst.size) out.push({ room, targets, breaches: [...worst.values()] });
  }
  return out.sort((a, b) => a.room.localeCompare(b.room));
}

/**
 * Alerts from several sources as one list (the server's, and the phone's readings it has not
 * seen yet): per room, each measure and side kept once at its worst, with the latest targets
 * given for the room. Rooms in name order.
 */
export function mergeRoomAlerts(...lists: readonly (readonly RoomAlert[])[]): RoomAlert[] {
  const rooms = new Map<
    string,
    { targets: RoomTargets; worst: Map<string, RoomAlert['breaches'][number]> }
  >();
  for (const list of lists)
    for (const a of list) {
      const room = rooms.get(a.room) ?? { targets: a.targets, worst: new Map() };
      room.targets = a.targets;
      for (const b of a.breaches) {
        const key = `${b.measure}:${b.side}`;
        const prev = room.worst.get(key);
        const further =
          b.side === 'high'
            ? b.value > (prev?.value ?? -Infinity)
            : b.value < (prev?.value ?? Infinity);
        if (!prev || further) room.worst.set(key, b);
      }
      rooms.set(a.room, room);
    }
  return [...rooms]
    .map(([room, { targets, worst }]) => ({ room, targets, breaches: [...worst.values()] }))
    .sort((a, b) => a.room.localeCompare(b.room));
}

/** "Spare room: up to 31.0 °C, above the range 24.0–28.0 °C." */
export function describeRoomAlert(a: RoomAlert, unit: TemperatureUnit, locale?: string): string {
  return `${a.room}: ${a.breaches.map((b) => describeBreach(b, a.targets, unit, locale)).join('; ')}.`;
}

/** The owner's morning e-mail: null when there is nothing to say (no mail is sent then). */
export function dailyMail(input: {
  collectionName: string;
  date: LocalDate;
  alerts: readonly RoomAlert[];
  unit: TemperatureUnit;
  link: string;
}): { subject: string; text: string } | null {
  if (!input.alerts.length) return null;
  const n = input.alerts.length;
  return {
    subject: `${input.collectionName}: ${n === 1 ? 'a room was' : `${n} rooms were`} out of range`,
    text: [
      `Good morning. In the last day ${n === 1 ? 'one room' : `${n} rooms`} of ${input.collectionName} left the range you set:`,
      '',
      ...input.alerts.map((a) => `- ${describeRoomAlert(a, input.unit)}`),
      '',
      `Rooms and readings: ${input.link}`,
      '',
      'You get this e-mail only on mornings with something to report.',
    ].join('\n'),
  };
}
