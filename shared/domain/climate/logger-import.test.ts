import { describe, expect, it } from 'vitest';
import { readCsv } from '../csv/csv-file';
import { guessLoggerSettings, planLoggerImport } from './logger-import';

// The autumn change in Europe/Amsterdam (IANA tz database, Rule EU): 2026-10-25 03:00 CEST
// becomes 02:00 CET, so the logger's clock shows 02:00–02:59 twice.
const AUTUMN = [
  'Timestamp,Temperature (°F),RH (%)',
  '2026-10-25 01:30,77.0,70',
  '2026-10-25 02:00,77.2,70',
  '2026-10-25 02:30,77.4,71',
  '2026-10-25 02:00,76.8,71',
  '2026-10-25 02:30,76.6,72',
  '2026-10-25 03:00,76.5,72',
].join('\r\n');

describe('planLoggerImport', () => {
  it('guesses the columns and the unit from the header', () => {
    expect(guessLoggerSettings(readCsv(AUTUMN).headers)).toEqual({
      time: 0,
      temperature: 1,
      humidity: 2,
      unit: 'F',
    });
  });

  it('reads the repeated autumn hour by the order of the rows, in °C', () => {
    const table = readCsv(AUTUMN);
    const plan = planLoggerImport(table, {
      ...guessLoggerSettings(table.headers),
      zone: 'Europe/Amsterdam',
    });
    expect(plan.problems).toEqual([]);
    expect(plan.rows.map((r) => [r.line, r.takenAt, r.celsius, r.ambiguous])).toEqual([
      [2, '2026-10-24T23:30:00.000Z', 25, false],
      [3, '2026-10-25T00:00:00.000Z', 25.11, true],
      [4, '2026-10-25T00:30:00.000Z', 25.22, true],
      [5, '2026-10-25T01:00:00.000Z', 24.89, true],
      [6, '2026-10-25T01:30:00.000Z', 24.78, true],
      [7, '2026-10-25T02:00:00.000Z', 24.72, false],
    ]);
  });

  it('refuses the skipped spring hour and every bad row by line, keeping the rest', () => {
    const csv = [
      'time;temp;hum',
      '2026-03-29 01:30;24,0;65',
      '2026-03-29 02:30;24,1;65',
      '2026-03-29 03:00;24,2;101',
      'soon;24,3;65',
      '2026-03-29 03:30;;',
      '2026-03-29 04:00;warm;60',
      '2026-03-29 04:30;90;60',
      '2026-03-29 05:00;24,4;66',
      '2026-03-29 05:00;24,5;66',
    ].join('\n');
    const table = readCsv(csv);
    const plan = planLoggerImport(table, {
      time: 0,
      temperature: 1,
      humidity: 2,
      unit: 'C',
      zone: 'Europe/Amsterdam',
    });
    expect(plan.rows.map((r) => [r.line, r.takenAt, r.celsius, r.humidity])).toEqual([
      [2, '2026-03-29T00:30:00.000Z', 24, 65],
      [9, '2026-03-29T03:00:00.000Z', 24.4, 66],
    ]);
    expect(plan.problems.map((p) => p.line)).toEqual([3, 4, 5, 6, 7, 8, 10]);
    expect(plan.problems[0]!.message).toMatch(/never happened in Europe\/Amsterdam/);
    expect(plan.problems[1]!.message).toMatch(/0 to 100/);
    expect(plan.problems[6]!.message).toMatch(/same time as line 9/);
    // Nothing lost: every record is a row or a problem.
    expect(plan.rows.length + plan.problems.length).toBe(table.records.length);
  });

  it('asks for the settings it needs', () => {
    const table = readCsv(AUTUMN);
    const base = { time: 0, temperature: 1, humidity: 2, unit: 'C' as const };
    expect(planLoggerImport(table, { ...base, zone: 'Mars/Olympus' }).problems[0]!.message).toMatch(
      /time zone/,
    );
    expect(
      planLoggerImport(table, { ...base, temperature: null, humidity: null, zone: 'UTC' })
        .problems[0]!.message,
    ).toMatch(/temperature column/);
  });
});
