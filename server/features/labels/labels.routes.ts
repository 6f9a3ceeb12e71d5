import { Router, type RequestHandler } from 'express';
import { z } from 'zod';
import type { Role } from '#shared/domain/roles';
import { uuid } from '#shared/schemas/common';
import { labelPdfBody, type LabelPdfBody } from '#shared/schemas/labels';
import { membershipOf } from '../../middleware/roles';
import { input, validate } from '../../middleware/validate';
import type { LabelsService } from './labels.service';

const animalParams = z.object({ collectionId: uuid, animalId: uuid });

/** Printing and re-labelling are keepers' work; helpers only scan. */
export function labelsRoutes(labels: LabelsService, member: (min: Role) => RequestHandler) {
  const router = Router({ mergeParams: true });

  router.post(
    '/labels/pdf',
    member('keeper'),
    validate({ body: labelPdfBody }),
    async (_req, res) => {
      const { collectionId, labelTag } = membershipOf(res);
      const pdf = await labels.pdf(collectionId, labelTag, input<LabelPdfBody>(res, 'body'));
      res
        .type('application/pdf')
        .set('Content-Disposition', 'attachment; filename="rackside-labels.pdf"')
        .set('Cache-Control', 'no-store')
        .send(pdf);
    },
  );

  router.post(
    '/animals/:animalId/relabel',
    member('keeper'),
    validate({ params: animalParams }),
    async (_req, res) => {
      const { animalId } = input<{ animalId: string }>(res, 'params');
      res.json({ labelCode: await labels.relabel(membershipOf(res).collectionId, animalId) });
    },
  );

  return router;
}
