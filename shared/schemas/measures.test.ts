import { describe, expect, it } from 'vitest';
import { temperatureToCelsius } from '../domain/temperature';
import { celsius, relativeHumidity } from './measures';

const message = (r: { success: boolean; error?: { issues: { message: string }[] } }) =>
  r.error?.issues[0]?.message;

describe('room readings at the API edge', () => {
  it('takes °C to a hundredth, as the client stores what a person typed in °F', () => {
    expect(celsius.parse(26.5)).toBe(26.5);
    expect(celsius.parse(temperatureToCelsius(79.8, 'F'))).toBe(26.56);
    expect(message(celsius.safeParse(26.555))).toBe(
      'Give the temperature to a hundredth of a degree at most.',
    );
    expect(message(celsius.safeParse(212))).toBe('Use 70 °C or less.');
    expect(message(celsius.safeParse('26'))).toBe(
      'Give the temperature as a number of degrees Celsius.',
    );
  });

  it('takes relative humidity from 0 to 100 %', () => {
    expect(relativeHumidity.parse(0)).toBe(0);
    expect(relativeHumidity.parse(100)).toBe(100);
    expect(message(relativeHumidity.safeParse(100.5))).toBe(
      'Relative humidity is from 0 to 100 %.',
    );
    expect(message(relativeHumidity.safeParse(-1))).toBe('Relative humidity is from 0 to 100 %.');
  });
});
