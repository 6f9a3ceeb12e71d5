import { randomInt } from 'node:crypto';
import { generateLabelCodes } from '#shared/domain/label-codes';
import { labelContent, printProblem } from '#shared/domain/labels/label-content';
import { sheetLayout } from '#shared/domain/labels/sheet-layout';
import type { LabelPdfBody } from '#shared/schemas/labels';
import type { Db } from '../../db/client';
import { isUniqueViolation } from '../../db/errors';
import { HttpError } from '../../middleware/errors';
import { animalsByIds, codesInCollection, labelCodeOf, setLabelCode } from './labels.repository';

const randomUnit = () => randomInt(2 ** 32) / 2 ** 32;

export function createLabelsService(db: Db) {
  return {
    /** The PDF of label sheets for some of a collection's animals, in the order asked. */
    async pdf(collectionId: string, labelTag: string, body: LabelPdfBody): Promise<Buffer> {
      const ids = [...new Set(body.animalIds)];
      const rows = await animalsByIds(db, collectionId, ids);
      if (rows.length !== ids.length) {
        throw new HttpError(
          404,
          'not_found',
          'Some of these animals are not in this collection. Reload the list and choose again.',
        );
      }
      const byId = new Map(rows.map((r) => [r.id, r]));
      const sheet = sheetLayout(body.sheet, body.size);
      const labels = ids.map((id) => {
        const a = byId.get(id)!;
        return labelContent(
          { ...a, cautions: a.cautions as never },
          labelTag,
          body.origin,
          body.size,
          body.fields,
        );
      });
      const problem = printProblem(labels);
      if (problem) throw new HttpError(422, 'label_too_small', problem);
      if (body.start > sheet.perSheet) {
        throw new HttpError(
          422,
          'invalid',
          `This sheet has ${sheet.perSheet} positions; start at ${sheet.perSheet} or earlier.`,
        );
      }
      // pdfkit (~28 MB resident) loads on the first PDF, not with the server.
      const { renderLabelsPdf } = await import('./labels.pdf');
      return renderLabelsPdf(labels, sheet, body.start);
    },

    /**
     * A new code for one animal (a lost or damaged label), same prefix. The old code stops
     * working at once. Moving an animal never changes its code; only this does.
     */
    async relabel(collectionId: string, animalId: string): Promise<string> {
      const current = await labelCodeOf(db, collectionId, animalId);
      if (current === null) throw new HttpError(404, 'not_found', 'We could not find that animal.');
      const prefix = current.split('-')[0]!;
      for (let attempt = 0; ; attempt++) {
        const taken = new Set(await codesInCollection(db, collectionId));
        const [code] = generateLabelCodes(prefix, 1, randomUnit, taken);
        try {
          await setLabelCode(db, animalId, code!, new Date());
          return code!;
        } catch (err) {
          // Someone took the same code a moment ago: draw again.
          if (!isUniqueViolation(err) || attempt >= 3) throw err;
        }
      }
    },
  };
}
export type LabelsService = ReturnType<typeof createLabelsService>;
