import type { CsvTable } from '../csv/csv-file';
import {
  humidityProblem,
  temperatureToCelsius,
  TEMPERATURE_SYMBOL,
  type TemperatureUnit,
} from '../temperature';
import { isIanaTimeZone } from '../time-zone';
import { resolveLoggerTime } from './logger-times';

/** The ends a room thermometer can report (the API's `celsius` limits). */
const CELSIUS_RANGE = { min: -50, max: 70 };

/** How to read a logger's file: which column holds what, its unit and its clock's zone. */
export interface LoggerSettings {
  /** Column indexes in the file; temperature or humidity may be left out, not both. */
  time: number | null;
  temperature: number | null;
  humidity: number | null;
  unit: TemperatureUnit;
  /** The logger's IANA zone, e.g. "Europe/Amsterdam". */
  zone: string;
}

export interface LoggerRow {
  line: number;
  /** ISO instant (UTC). */
  takenAt: string;
  celsius: number | null;
  humidity: number | null;
  /** Read in the repeated autumn hour by the order of the rows (logger-times.ts). */
  ambiguous: boolean;
}
export interface LoggerProblem {
  line: number;
  message: string;
}
export interface LoggerPlan {
  rows: LoggerRow[];
  problems: LoggerProblem[];
}

/** Our best guess of the columns and unit from the file's header. */
export function guessLoggerSettings(headers: string[]): Omit<LoggerSettings, 'zone'> {
  const find = (re: RegExp) => {
    const i = headers.findIndex((h) => re.test(h));
    return i < 0 ? null : i;
  };
  const temperature = find(/temp|°\s*[cf]\b|\(\s*[cf]\s*\)/i);
  const header = temperature === null ? '' : headers[temperature]!;
  return {
    time: find(/time|date|zeit|datum|stamp|when/i),
    temperature,
    humidity: find(/hum|\brh\b|feucht|%/i),
    unit: /°\s*f\b|\(\s*f\s*\)|fahrenheit/i.test(header) ? 'F' : 'C',
  };
}

/** "24.5", "24,5" (decimal comma) or "" (no value). NaN for anything else. */
function readNumber(cell: string): number | null {
  const t = cell.trim().replace(/\s*(%|°\s*[CF])$/i, '');
  if (!t) return null;
  const normal = t.includes('.') ? t : t.replace(',', '.');
  return /^[+-]?\d+(\.\d+)?$/.test(normal) ? Number(normal) : Number.NaN;
}

const describeWall = (cell: string) => `“${cell.trim()}”`;

/**
 * Every row of a logger's file as a reading, or as a problem with its line: nothing is
 * dropped without a word. Rows are read in file order, which settles the repeated autumn hour.
 */
export function planLoggerImport(table: CsvTable, s: LoggerSettings): LoggerPlan {
  const problems: LoggerProblem[] = [];
  const rows: LoggerRow[] = [];
  if (s.time === null) return { rows, problems: [{ line: 1, message: 'Choose the time column.' }] };
  if (s.temperature === null && s.humidity === null)
    return {
      rows,
      problems: [
        { line: 1, message: 'Choose the temperature column, the humidity column or both.' },
      ],
    };
  if (!isIanaTimeZone(s.zone))
    return {
      rows,
      problems: [{ line: 1, message: 'Choose the logger’s time zone, e.g. Europe/Amsterdam.' }],
    };
  let previous: Date | null = null;
  const seen = new Map<number, number>();
  for (const record of table.records) {
    const cell = (i: number | null) => (i === null ? '' : (record.cells[i] ?? ''));
    const timeCell = cell(s.time);
    const problem = (message: string) => problems.push({ line: record.line, message });
    const time = resolveLoggerTime(timeCell, s.zone, previous);
    if (!time.ok) {
      problem(
        time.reason === 'invalid'
          ? `The time ${describeWall(timeCell)} is not a date and time we can read (use e.g. 2026-10-25 02:30).`
          : `The time ${describeWall(timeCell)} never happened in ${s.zone}: the clocks skipped that hour.`,
      );
      continue;
    }
    const celsiusRaw = readNumber(cell(s.temperature));
    const humidity = readNumber(cell(s.humidity));
    if (Number.isNaN(celsiusRaw)) {
      problem(`The temperature “${cell(s.temperature).trim()}” is not a number.`);
      continue;
    }
    if (Number.isNaN(humidity)) {
      problem(`The humidity “${cell(s.humidity).trim()}” is not a number.`);
      continue;
    }
    if (celsiusRaw === null && humidity === null) {
      problem('This row has neither a temperature nor a humidity.');
      continue;
    }
    const celsius = celsiusRaw === null ? null : temperatureToCelsius(celsiusRaw, s.unit);
    if (celsius !== null && (celsius < CELSIUS_RANGE.min || celsius > CELSIUS_RANGE.max)) {
      problem(
        `The temperature ${celsiusRaw} ${TEMPERATURE_SYMBOL[s.unit]} is beyond what a room can have: check the unit.`,
      );
      continue;
    }
    const humidityWords = humidity === null ? null : humidityProblem(humidity);
    if (humidityWords) {
      problem(humidityWords);
      continue;
    }
    const ms = time.instant.getTime();
    const twin = seen.get(ms);
    if (twin !== undefined) {
      problem(`This row has the same time as line ${twin}.`);
      continue;
    }
    seen.set(ms, record.line);
    previous = time.instant;
    rows.push({
      line: record.line,
      takenAt: time.instant.toISOString(),
      celsius,
      humidity: humidity === null ? null : Math.round(humidity * 10) / 10,
      ambiguous: time.ambiguous,
    });
  }
  return { rows, problems };
}
