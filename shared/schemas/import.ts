import { z } from 'zod';
import { animalFields, checkStageFitsGroup } from './animals';
import { locationInput } from './locations';

/** One animal from a spreadsheet: what a form takes, with its place by name instead of by id. */
export const animalImportRow = animalFields
  .omit({ locationId: true })
  .extend({ place: locationInput.nullable() })
  .superRefine(checkStageFitsGroup);
export type AnimalImportRow = z.input<typeof animalImportRow>;
export type AnimalImportValues = z.output<typeof animalImportRow>;

export const MAX_IMPORT_ROWS = 5000;
export const animalImportBody = z.object({
  rows: z
    .array(animalImportRow)
    .min(1, { message: 'There are no rows to import.' })
    .max(MAX_IMPORT_ROWS, { message: `Import at most ${MAX_IMPORT_ROWS} animals at a time.` }),
});
export const importResponse = z.object({ imported: z.number().int() });
