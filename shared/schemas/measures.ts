import { z } from 'zod';
import { HUMIDITY_MAX, HUMIDITY_MIN, STORED_CELSIUS_DIGITS } from '../domain/temperature';
import './messages';

/**
 * Room readings as the API takes them: temperatures always in °C (the client converts from the
 * person's unit with `temperatureToCelsius`), humidity in percent.
 */

/** What a room thermometer or a data logger can report; beyond it is a typing or sensor slip. */
export const CELSIUS_LIMITS = { min: -50, max: 70 } as const;

export const celsius = z
  .number({ message: 'Give the temperature as a number of degrees Celsius.' })
  .min(CELSIUS_LIMITS.min, { message: `Use ${CELSIUS_LIMITS.min} °C or more.` })
  .max(CELSIUS_LIMITS.max, { message: `Use ${CELSIUS_LIMITS.max} °C or less.` })
  .refine((c) => Number(c.toFixed(STORED_CELSIUS_DIGITS)) === c, {
    message: 'Give the temperature to a hundredth of a degree at most.',
  });

/** Relative humidity: 0–100 % (see `isRelativeHumidity`). */
export const relativeHumidity = z
  .number({ message: 'Give the humidity as a number from 0 to 100.' })
  .min(HUMIDITY_MIN, { message: 'Relative humidity is from 0 to 100 %.' })
  .max(HUMIDITY_MAX, { message: 'Relative humidity is from 0 to 100 %.' });
