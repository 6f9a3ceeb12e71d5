import { describe, expect, it } from 'vitest';
import { temperatureInUnit, temperatureToCelsius } from '../temperature';
import {
  breachesOf,
  describeBreach,
  describeTemperatureRange,
  targetsProblem,
  type ReadingValues,
  type RoomTargets,
} from './ranges';

const targets: RoomTargets = { minCelsius: 24, maxCelsius: 28, minHumidity: 60, maxHumidity: 80 };
const typed = (min: number, max: number, humidity: number | null = 70): ReadingValues => ({
  currentCelsius: null,
  minCelsius: min,
  maxCelsius: max,
  humidity,
});

describe('breachesOf (boundaries inclusive: a value equal to a bound is in range)', () => {
  it('finds nothing for a reading inside the range or exactly on its bounds', () => {
    expect(breachesOf(typed(24, 28, 60), targets)).toEqual([]);
    expect(breachesOf(typed(25.5, 26, 80), targets)).toEqual([]);
  });

  it('flags a hundredth beyond a bound', () => {
    expect(breachesOf(typed(23.99, 28.01, 70), targets)).toEqual([
      { measure: 'temperature', side: 'low', value: 23.99, limit: 24 },
      { measure: 'temperature', side: 'high', value: 28.01, limit: 28 },
    ]);
  });

  it('checks humidity on both sides', () => {
    expect(breachesOf(typed(25, 26, 59.9), targets)).toEqual([
      { measure: 'humidity', side: 'low', value: 59.9, limit: 60 },
    ]);
    expect(breachesOf(typed(25, 26, 85), targets)).toEqual([
      { measure: 'humidity', side: 'high', value: 85, limit: 80 },
    ]);
  });

  it('checks a logger row by its one temperature against both bounds', () => {
    const row = { currentCelsius: 31, minCelsius: null, maxCelsius: null, humidity: null };
    expect(breachesOf(row, targets)).toEqual([
      { measure: 'temperature', side: 'high', value: 31, limit: 28 },
    ]);
  });

  it('never breaks an empty bound', () => {
    const onlyMax: RoomTargets = { ...targets, minCelsius: null, minHumidity: null };
    expect(breachesOf(typed(5, 20, 10), onlyMax)).toEqual([]);
  });

  it('refuses a minimum above its maximum', () => {
    expect(targetsProblem({ ...targets, minCelsius: 29 })).toMatch(/Swap/);
    expect(targetsProblem(targets)).toBeNull();
  });
});

describe('in the person’s unit', () => {
  // t/°F = 1.8 · t/°C + 32, exact by definition (NIST SP 811, 2008, 4.2.1.1 — from memory):
  // 24 °C = 75.2 °F, 28 °C = 82.4 °F, 31 °C = 87.8 °F.
  it('writes the range and the breach in °F', () => {
    expect(describeTemperatureRange(targets, 'F')).toBe('75.2–82.4 °F');
    const [b] = breachesOf(typed(25, 31), targets);
    expect(describeBreach(b!, targets, 'F')).toBe('up to 87.8 °F, above the range 75.2–82.4 °F');
    expect(describeBreach(b!, targets, 'C')).toBe('up to 31.0 °C, above the range 24.0–28.0 °C');
  });

  it('gives the same verdict to a bound typed in °F as to the same bound in °C', () => {
    // 82.4 °F typed as the maximum is stored as exactly 28 °C (NIST SP 811 as above).
    const max = temperatureToCelsius(82.4, 'F');
    expect(max).toBe(28);
    const fTargets = { ...targets, maxCelsius: max };
    expect(breachesOf(typed(25, temperatureToCelsius(82.4, 'F')), fTargets)).toEqual([]);
    expect(breachesOf(typed(25, temperatureToCelsius(82.5, 'F')), fTargets)).toHaveLength(1);
  });

  it('round-trips every tenth of a °F a room can have', () => {
    for (let tenth = 320; tenth <= 1130; tenth++) {
      const f = tenth / 10;
      expect(temperatureInUnit(temperatureToCelsius(f, 'F'), 'F')).toBe(f);
    }
  });
});
