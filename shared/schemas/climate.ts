import { z } from 'zod';
import { targetsProblem } from '../domain/climate/ranges';
import { TEMPERATURE_UNITS } from '../domain/temperature';
import { celsius, relativeHumidity } from './measures';

/**
 * Room climate at the API edge: temperatures always in °C (the client converts from the
 * person's unit), humidity in % RH, any bound or value may be null.
 */

export const roomName = z
  .string({ message: 'Say which room.' })
  .trim()
  .min(1, { message: 'Say which room.' })
  .max(40, { message: 'Keep the room under 40 characters.' });

export const temperatureUnit = z.enum(TEMPERATURE_UNITS, {
  message: 'Choose °C or °F.',
});

export const roomTargets = z.object({
  minCelsius: celsius.nullable(),
  maxCelsius: celsius.nullable(),
  minHumidity: relativeHumidity.nullable(),
  maxHumidity: relativeHumidity.nullable(),
});
export type RoomTargetsBody = z.infer<typeof roomTargets>;

export const roomTargetsBody = roomTargets.extend({ room: roomName }).superRefine((t, ctx) => {
  const problem = targetsProblem(t);
  if (problem) ctx.addIssue({ code: 'custom', message: problem });
});
export type RoomTargetsInput = z.infer<typeof roomTargetsBody>;

/**
 * The typed daily reading: min and max since the last reading, the humidity now. It travels as
 * a room chore's payload (`CHORE_SUBJECTS.room` in chores.ts), so it is recorded offline and
 * stored once by the chore's phone-made id (decision 020).
 */
export const roomReadingPayload = z
  .object({
    minCelsius: celsius.nullable(),
    maxCelsius: celsius.nullable(),
    humidity: relativeHumidity.nullable(),
  })
  .strict()
  .superRefine((r, ctx) => {
    if (r.minCelsius === null && r.maxCelsius === null && r.humidity === null)
      ctx.addIssue({ code: 'custom', message: 'Give a temperature or the humidity.' });
    if (r.minCelsius !== null && r.maxCelsius !== null && r.minCelsius > r.maxCelsius)
      ctx.addIssue({
        code: 'custom',
        message: 'The lowest temperature is above the highest. Swap them.',
        path: ['minCelsius'],
      });
  });
export type RoomReadingPayload = z.infer<typeof roomReadingPayload>;

export const MAX_LOGGER_ROWS = 10_000;

/** A logger file's rows, already read and converted by the phone (planLoggerImport). */
export const loggerImportBody = z.object({
  room: roomName,
  rows: z
    .array(
      z
        .object({
          takenAt: z.iso.datetime({ offset: true }),
          celsius: celsius.nullable(),
          humidity: relativeHumidity.nullable(),
        })
        .refine((r) => r.celsius !== null || r.humidity !== null, {
          message: 'Each row needs a temperature or a humidity.',
        }),
    )
    .min(1, { message: 'The file has no readings to import.' })
    .max(MAX_LOGGER_ROWS, {
      message: `Import at most ${MAX_LOGGER_ROWS} rows at once: split the file.`,
    }),
});
export type LoggerImportBody = z.infer<typeof loggerImportBody>;

export const roomQuery = z.object({
  room: roomName,
  days: z.coerce
    .number({ message: 'Give the number of days.' })
    .int({ message: 'Give a whole number of days.' })
    .min(1, { message: 'Ask for 1 to 366 days.' })
    .max(366, { message: 'Ask for 1 to 366 days.' })
    .default(30),
});

export const preferencesBody = z.object({ temperatureUnit });

const nullableNumber = z.number().nullable();
export const reading = z.object({
  id: z.string(),
  room: z.string(),
  takenAt: z.string(),
  currentCelsius: nullableNumber,
  minCelsius: nullableNumber,
  maxCelsius: nullableNumber,
  humidity: nullableNumber,
  source: z.enum(['typed', 'logger']),
});
export type Reading = z.infer<typeof reading>;

export const breach = z.object({
  measure: z.enum(['temperature', 'humidity']),
  side: z.enum(['low', 'high']),
  value: z.number(),
  limit: z.number(),
});

export const roomAlert = z.object({
  room: z.string(),
  targets: roomTargets,
  breaches: z.array(breach.extend({ takenAt: z.string() })),
});

/** Today's climate for the person: rooms due their typed reading, and rooms out of range. */
export const climateTodayResponse = z.object({
  rooms: z.array(
    z.object({
      room: z.string(),
      targets: roomTargets,
      /** No typed reading yet today (collection's day). */
      due: z.boolean(),
    }),
  ),
  alerts: z.array(roomAlert),
});
export type ClimateToday = z.infer<typeof climateTodayResponse>;

export const roomTargetsResponse = roomTargets.extend({ room: z.string() });

export const daySummary = z.object({
  date: z.string(),
  lowCelsius: nullableNumber,
  highCelsius: nullableNumber,
  lowHumidity: nullableNumber,
  highHumidity: nullableNumber,
  readings: z.number(),
});
export type DaySummaryView = z.infer<typeof daySummary>;

/** Every room of the collection with its targets and latest reading. */
export const climateRoomsResponse = z.object({
  rooms: z.array(z.object({ room: z.string(), targets: roomTargets, latest: reading.nullable() })),
});

export const roomHistoryResponse = z.object({
  room: z.string(),
  targets: roomTargets,
  days: z.array(daySummary),
  latest: z.array(reading),
});
export type RoomHistory = z.infer<typeof roomHistoryResponse>;

export const loggerImportResponse = z.object({ added: z.number(), alreadyThere: z.number() });

export const animalClimateResponse = z.object({
  room: z.string().nullable(),
  targets: roomTargets.nullable(),
  days: z.array(daySummary),
});
export type AnimalClimate = z.infer<typeof animalClimateResponse>;
