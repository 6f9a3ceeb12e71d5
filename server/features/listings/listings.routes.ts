import { Router, type RequestHandler } from 'express';
import type { Role } from '#shared/domain/roles';
import { collectionParams } from '#shared/schemas/common';
import {
  bulkListingBody,
  listingBody,
  listingParams,
  type BulkListingBody,
  type ListingBody,
} from '#shared/schemas/listings';
import { currentUserId } from '../../middleware/auth';
import { membershipOf } from '../../middleware/roles';
import { input, validate } from '../../middleware/validate';
import type { ListingsService } from './listings.service';

/**
 * Mounted on /collections/:collectionId/listings. Owners and keepers sell; a helper never sees
 * a price (sales part L).
 */
export function listingsRoutes(service: ListingsService, member: (min: Role) => RequestHandler) {
  const router = Router({ mergeParams: true });
  const animalId = (res: Parameters<RequestHandler>[1]) =>
    input<{ animalId: string }>(res, 'params').animalId;

  router.get('/', member('keeper'), validate({ params: collectionParams }), async (_req, res) => {
    res.set('Cache-Control', 'no-store').json(await service.list(membershipOf(res)));
  });

  router.post(
    '/bulk',
    member('keeper'),
    validate({ params: collectionParams, body: bulkListingBody }),
    async (req, res) => {
      res.json(
        await service.bulk(
          membershipOf(res),
          currentUserId(req),
          input<BulkListingBody>(res, 'body'),
        ),
      );
    },
  );

  router.put(
    '/:animalId',
    member('keeper'),
    validate({ params: listingParams, body: listingBody }),
    async (req, res) => {
      res.json(
        await service.put(
          membershipOf(res),
          currentUserId(req),
          animalId(res),
          input<ListingBody>(res, 'body'),
        ),
      );
    },
  );

  router.delete(
    '/:animalId',
    member('keeper'),
    validate({ params: listingParams }),
    async (_req, res) => {
      await service.remove(membershipOf(res), animalId(res));
      res.status(204).end();
    },
  );

  return router;
}
