import { formatHumidity, formatTemperature, type TemperatureUnit } from '../temperature';

/**
 * A room's target range and what a reading says against it.
 *
 * Boundaries are inclusive: a reading equal to a bound is in range (a target of 24–28 °C is
 * met at exactly 28.0 °C); only a value beyond a bound is out of range. Any bound may be
 * empty, and an empty bound is never broken. Values are compared as stored (°C to a
 * hundredth, % RH), never after conversion to the person's unit, so °F readers get the same
 * verdicts as °C readers.
 */
export interface RoomTargets {
  minCelsius: number | null;
  maxCelsius: number | null;
  minHumidity: number | null;
  maxHumidity: number | null;
}

export interface ReadingValues {
  /** A logger's row has the temperature at its instant; a typed reading has min and max. */
  currentCelsius: number | null;
  minCelsius: number | null;
  maxCelsius: number | null;
  humidity: number | null;
}

export type Measure = 'temperature' | 'humidity';
export interface Breach {
  measure: Measure;
  side: 'low' | 'high';
  /** The value that broke the bound (°C or % RH). */
  value: number;
  /** The bound it broke. */
  limit: number;
}

export const NO_TARGETS: RoomTargets = {
  minCelsius: null,
  maxCelsius: null,
  minHumidity: null,
  maxHumidity: null,
};

export function hasTargets(t: RoomTargets): boolean {
  return Object.values(t).some((v) => v !== null);
}

/** Why a range cannot be stored (a minimum above its maximum), or null. */
export function targetsProblem(t: RoomTargets): string | null {
  if (t.minCelsius !== null && t.maxCelsius !== null && t.minCelsius > t.maxCelsius)
    return 'The lowest temperature is above the highest. Swap them.';
  if (t.minHumidity !== null && t.maxHumidity !== null && t.minHumidity > t.maxHumidity)
    return 'The lowest humidity is above the highest. Swap them.';
  return null;
}

/**
 * Every bound a reading breaks: at most one low and one high per measure. The lowest
 * temperature the reading knows (its min, else its current value) is checked against the
 * target minimum, the highest (its max, else current) against the maximum.
 */
export function breachesOf(r: ReadingValues, t: RoomTargets): Breach[] {
  const out: Breach[] = [];
  const temps = [r.minCelsius, r.currentCelsius, r.maxCelsius].filter(
    (v): v is number => v !== null,
  );
  if (temps.length) {
    const low = Math.min(...temps);
    const high = Math.max(...temps);
    if (t.minCelsius !== null && low < t.minCelsius)
      out.push({ measure: 'temperature', side: 'low', value: low, limit: t.minCelsius });
    if (t.maxCelsius !== null && high > t.maxCelsius)
      out.push({ measure: 'temperature', side: 'high', value: high, limit: t.maxCelsius });
  }
  if (r.humidity !== null) {
    if (t.minHumidity !== null && r.humidity < t.minHumidity)
      out.push({ measure: 'humidity', side: 'low', value: r.humidity, limit: t.minHumidity });
    if (t.maxHumidity !== null && r.humidity > t.maxHumidity)
      out.push({ measure: 'humidity', side: 'high', value: r.humidity, limit: t.maxHumidity });
  }
  return out;
}

/** "24.0–28.0 °C", "at least 24.0 °C", "at most 28.0 °C", or null without bounds. */
export function describeTemperatureRange(
  t: Pick<RoomTargets, 'minCelsius' | 'maxCelsius'>,
  unit: TemperatureUnit,
  locale?: string,
): string | null {
  const low = t.minCelsius === null ? null : formatTemperature(t.minCelsius, unit, locale);
  const high = t.maxCelsius === null ? null : formatTemperature(t.maxCelsius, unit, locale);
  if (low && high) return `${low.split(' ')[0]}–${high}`;
  if (low) return `at least ${low}`;
  if (high) return `at most ${high}`;
  return null;
}

/** "60–80 %", "at least 60 %", "at most 80 %", or null. */
export function describeHumidityRange(
  t: Pick<RoomTargets, 'minHumidity' | 'maxHumidity'>,
  locale?: string,
): string | null {
  const low = t.minHumidity === null ? null : formatHumidity(t.minHumidity, locale);
  const high = t.maxHumidity === null ? null : formatHumidity(t.maxHumidity, locale);
  if (low && high) return `${low.split(' ')[0]}–${high}`;
  if (low) return `at least ${low}`;
  if (high) return `at most ${high}`;
  return null;
}

/**
 * One breach in words, in the reader's unit: "31.0 °C, above the range 24.0–28.0 °C" or
 * "humidity 45 %, below the range 60–80 %".
 */
export function describeBreach(
  b: Breach,
  t: RoomTargets,
  unit: TemperatureUnit,
  locale?: string,
): string {
  const where = b.side === 'high' ? 'above' : 'below';
  if (b.measure === 'temperature')
    return `${b.side === 'high' ? 'up to' : 'down to'} ${formatTemperature(b.value, unit, locale)}, ${where} the range ${describeTemperatureRange(t, unit, locale)}`;
  return `humidity ${formatHumidity(b.value, locale)}, ${where} the range ${describeHumidityRange(t, locale)}`;
}
