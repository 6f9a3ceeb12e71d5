import { z } from 'zod';
import { isIanaTimeZone } from '../domain/time-zone';
// Plain-language messages for zod's built-in checks, set up wherever the schemas are loaded
// (not in the client's first chunk, which ships without zod: P2, P4).
import './messages';

export const uuid = z.uuid({ message: 'This id is not valid.' });

export const timeZone = z
  .string()
  .trim()
  .refine(isIanaTimeZone, { message: 'Choose a time zone such as America/Toronto.' });

/** A calendar date written YYYY-MM-DD (ISO 8601 calendar date, extended format). */
export const localDate = z
  .string()
  // abort: a date not written YYYY-MM-DD gets that one message, not "does not exist" as well.
  .regex(/^\d{4}-\d{2}-\d{2}$/, { message: 'Write the date as YYYY-MM-DD.', abort: true })
  .refine(
    (s) => {
      const [y, m, d] = s.split('-').map(Number) as [number, number, number];
      const date = new Date(Date.UTC(y, m - 1, d));
      return y >= 1900 && y <= 2200 && date.toISOString().slice(0, 10) === s;
    },
    { message: 'This date does not exist.' },
  );

export const errorBody = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    issues: z.array(z.object({ path: z.string(), message: z.string() })).optional(),
  }),
});
export type ErrorBody = z.infer<typeof errorBody>;

export const collectionParams = z.object({ collectionId: uuid });

/** A 204 answer: no body, read by the client as `undefined`. */
export const noContent = z.undefined();

/** A record made by a POST that answers with its new id only. */
export const createdResponse = z.object({ id: z.string() });
