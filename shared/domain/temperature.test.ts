import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  celsiusToFahrenheit,
  fahrenheitToCelsius,
  formatHumidity,
  formatTemperature,
  formatTemperatureRange,
  humidityProblem,
  isRelativeHumidity,
  temperatureDifferenceInUnit,
  temperatureInUnit,
  temperatureToCelsius,
} from './temperature';

// t/°F = 1.8 · t/°C + 32, exact by definition: NIST Special Publication 811 (2008 edition),
// "Guide for the Use of the International System of Units (SI)", 4.2.1.1 and Appendix B.9
// (section numbers from memory). The worked values below follow from that formula by hand.
describe('°C ↔ °F (NIST SP 811, 2008)', () => {
  it('meets at −40, freezes at 32 °F and boils at 212 °F', () => {
    expect(celsiusToFahrenheit(-40)).toBe(-40);
    expect(fahrenheitToCelsius(-40)).toBe(-40);
    expect(celsiusToFahrenheit(0)).toBe(32);
    expect(fahrenheitToCelsius(32)).toBe(0);
    expect(celsiusToFahrenheit(100)).toBe(212);
    expect(fahrenheitToCelsius(212)).toBe(100);
  });

  it('shows a warm sling room to one decimal in either unit', () => {
    // 1.8 × 26.5 = 47.7; + 32 = 79.7.
    expect(temperatureInUnit(26.5, 'F')).toBe(79.7);
    expect(temperatureInUnit(26.5, 'C')).toBe(26.5);
    expect(temperatureToCelsius(79.7, 'F')).toBe(26.5);
    // 1.8 × 22.25 = 40.05; + 32 = 72.05 → 72.1 (half away from zero, not the binary 72.04999…).
    expect(temperatureInUnit(22.25, 'F')).toBe(72.1);
    // 1.8 × 18.3 = 32.94; + 32 = 64.94 → 64.9.
    expect(temperatureInUnit(18.3, 'F')).toBe(64.9);
    // (75 − 32) / 1.8 = 23.888… → stored 23.89 °C, shown 23.9 °C and 75.0 °F again.
    expect(temperatureToCelsius(75, 'F')).toBe(23.89);
    expect(temperatureInUnit(23.89, 'F')).toBe(75);
  });

  it('formats with the unit, one decimal and a true minus sign', () => {
    expect(formatTemperature(26.5, 'C', 'en')).toBe('26.5 °C');
    expect(formatTemperature(26.5, 'F', 'en')).toBe('79.7 °F');
    expect(formatTemperature(-40, 'F', 'en')).toBe('−40.0 °F');
    expect(formatTemperature(0, 'F', 'en')).toBe('32.0 °F');
    expect(formatTemperature(100, 'F', 'en')).toBe('212.0 °F');
    expect(formatTemperature(-0.04, 'C', 'en')).toBe('0.0 °C');
    expect(formatTemperature(26.5, 'C', 'de')).toBe('26,5 °C');
    expect(formatTemperature(null, 'F', 'en')).toBe('—');
    expect(formatTemperatureRange(24, 28, 'C', 'en')).toBe('24.0–28.0 °C');
    expect(formatTemperatureRange(24, 28, 'F', 'en')).toBe('75.2–82.4 °F');
  });

  it('converts a difference with the factor alone', () => {
    expect(temperatureDifferenceInUnit(4, 'F')).toBe(7.2);
    expect(temperatureDifferenceInUnit(4, 'C')).toBe(4);
  });

  it('gives back every °F tenth typed from −40 to 140 exactly (stored in °C to a hundredth)', () => {
    fc.assert(
      fc.property(fc.integer({ min: -400, max: 1400 }), (tenths) => {
        const typed = tenths / 10;
        expect(temperatureInUnit(temperatureToCelsius(typed, 'F'), 'F')).toBe(typed);
      }),
      { numRuns: 2000 },
    );
  });

  it('gives back every °C tenth from −40 to 60, whichever unit it passes through', () => {
    for (let tenths = -400; tenths <= 600; tenths++) {
      const c = tenths / 10;
      expect(temperatureInUnit(temperatureToCelsius(c, 'C'), 'C')).toBe(c);
      // Shown in °F, typed back as shown, shown in °C again: within the °F tenth's rounding.
      const viaF = temperatureToCelsius(temperatureInUnit(c, 'F'), 'F');
      expect(Math.abs(viaF - c)).toBeLessThanOrEqual(0.03);
      expect(temperatureInUnit(viaF, 'C')).toBe(c);
    }
  });

  it('keeps the exact functions inverse to each other', () => {
    fc.assert(
      fc.property(fc.double({ min: -100, max: 200, noNaN: true }), (c) => {
        expect(fahrenheitToCelsius(celsiusToFahrenheit(c))).toBeCloseTo(c, 9);
      }),
    );
  });
});

describe('relative humidity (0–100 %)', () => {
  it('accepts 0 to 100 and nothing else', () => {
    expect(isRelativeHumidity(0)).toBe(true);
    expect(isRelativeHumidity(72.5)).toBe(true);
    expect(isRelativeHumidity(100)).toBe(true);
    expect(isRelativeHumidity(-0.1)).toBe(false);
    expect(isRelativeHumidity(100.1)).toBe(false);
    expect(isRelativeHumidity(Number.NaN)).toBe(false);
    expect(humidityProblem(72)).toBeNull();
    expect(humidityProblem(140)).toBe('Relative humidity is from 0 to 100 %. Check the reading.');
    expect(humidityProblem(Number.NaN)).toBe('Give the humidity as a number from 0 to 100.');
  });

  it('shows at most a tenth', () => {
    expect(formatHumidity(72, 'en')).toBe('72 %');
    expect(formatHumidity(72.46, 'en')).toBe('72.5 %');
    expect(formatHumidity(null, 'en')).toBe('—');
  });
});
