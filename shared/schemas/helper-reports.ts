import { z } from 'zod';
import { HELPER_REPORT_KINDS } from '../domain/helper-reports';
import { uuid } from './common';

/** A helper's report: what happened, about which animal (if any), in their own words. */
export const helperReportBody = z.object({
  kind: z.enum(HELPER_REPORT_KINDS, { message: 'Choose what happened.' }),
  /** An animal on today's round; null when it is about no animal or one off the round. */
  animalId: uuid.nullable().default(null),
  /** An animal off the round, by its label code or name as the helper reads it. */
  animalText: z
    .string({ message: 'Write the animal’s label code or name as text.' })
    .trim()
    .max(80, { message: 'Keep the animal’s code or name under 80 characters.' })
    .default(''),
  note: z
    .string({ message: 'Say in a few words what happened.' })
    .trim()
    .min(1, { message: 'Say in a few words what happened.' })
    .max(1000, { message: 'Keep the note under 1000 characters.' }),
});
export type HelperReportBody = z.infer<typeof helperReportBody>;
export type HelperReportInput = z.input<typeof helperReportBody>;

export const helperReportView = z.object({
  id: z.string(),
  kind: z.enum(HELPER_REPORT_KINDS),
  animal: z.object({ id: z.string(), name: z.string(), labelCode: z.string() }).nullable(),
  animalText: z.string(),
  note: z.string(),
  reportedBy: z.string(),
  createdAt: z.string(),
});
export type HelperReportView = z.infer<typeof helperReportView>;

export const helperReportsResponse = z.object({ reports: z.array(helperReportView) });
