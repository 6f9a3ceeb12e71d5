import { Router, type RequestHandler } from 'express';
import type { Role } from '#shared/domain/roles';
import { listingParams } from '#shared/schemas/listings';
import { membershipOf } from '../../middleware/roles';
import { input, validate } from '../../middleware/validate';
import type { CareSheetsService } from './care-sheets.service';

/**
 * Mounted on /collections/:collectionId/animals/:animalId: a buyer's care sheet and history,
 * made by owners and keepers (sales part L).
 */
export function careSheetsRoutes(
  service: CareSheetsService,
  member: (min: Role) => RequestHandler,
) {
  const router = Router({ mergeParams: true });
  const animalId = (res: Parameters<RequestHandler>[1]) =>
    input<{ animalId: string }>(res, 'params').animalId;

  router.get(
    '/care-sheet.pdf',
    member('keeper'),
    validate({ params: listingParams }),
    async (_req, res) => {
      const pdf = await service.pdf(membershipOf(res), animalId(res));
      res
        .type('application/pdf')
        .set('Content-Disposition', 'attachment; filename="care-sheet.pdf"')
        .set('Cache-Control', 'no-store')
        .send(pdf);
    },
  );

  router.get(
    '/history.csv',
    member('keeper'),
    validate({ params: listingParams }),
    async (_req, res) => {
      const csv = await service.historyCsv(membershipOf(res), animalId(res));
      res
        .type('text/csv; charset=utf-8')
        .set('Content-Disposition', 'attachment; filename="history.csv"')
        .set('Cache-Control', 'no-store')
        .send(csv);
    },
  );

  return router;
}
