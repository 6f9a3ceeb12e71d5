import { z } from 'zod';
import { LABEL_FIELDS } from '../domain/labels/label-layout';
import { CUSTOM_SIZE_LIMITS, SHEET_IDS } from '../domain/labels/sheet-layout';
import { uuid } from './common';

/** The most labels one PDF holds: a breeder's whole clutch and then some. */
export const MAX_LABELS_PER_PRINT = 1000;

const millimetres = z
  .number({ message: 'Give the size in millimetres.' })
  .min(CUSTOM_SIZE_LIMITS.minMm, {
    message: `Labels must be at least ${CUSTOM_SIZE_LIMITS.minMm} mm on each side.`,
  })
  .max(CUSTOM_SIZE_LIMITS.maxMm, {
    message: `Labels can be at most ${CUSTOM_SIZE_LIMITS.maxMm} mm on each side.`,
  });

export const labelPrintOptions = z.object({
  sheet: z.enum(SHEET_IDS, { message: 'Choose A4 or Letter.' }),
  size: z.object({ widthMm: millimetres, heightMm: millimetres }),
  fields: z.array(z.enum(LABEL_FIELDS)).max(LABEL_FIELDS.length),
  /** The first free cell (1-based) on a partly used first sheet. */
  start: z
    .number()
    .int({ message: 'The start position is a whole number.' })
    .min(1, { message: 'Start at position 1 or later.' }),
});
export type LabelPrintOptions = z.infer<typeof labelPrintOptions>;

export const labelPdfBody = labelPrintOptions.extend({
  animalIds: z
    .array(uuid)
    .min(1, { message: 'Choose at least one animal.' })
    .max(MAX_LABELS_PER_PRINT, {
      message: `At most ${MAX_LABELS_PER_PRINT} labels go in one PDF.`,
    }),
  /** The app's address as the phone sees it, so the PDF's QR codes match the browser print. */
  origin: z
    .string()
    .max(80, { message: 'That address is too long for a small QR symbol.' })
    .pipe(
      z.url({
        protocol: /^https?$/,
        message: 'The app address must start with http:// or https://.',
      }),
    ),
});
export type LabelPdfBody = z.infer<typeof labelPdfBody>;

export const relabelResponse = z.object({ labelCode: z.string() });
