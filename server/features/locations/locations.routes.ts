import { Router, type RequestHandler } from 'express';
import { z } from 'zod';
import type { Role } from '#shared/domain/roles';
import { uuid } from '#shared/schemas/common';
import {
  locationInput,
  renameGroupBody,
  walkOrderBody,
  type LocationValues,
  type RenameGroupOutput,
} from '#shared/schemas/locations';
import { membershipOf } from '../../middleware/roles';
import { input, validate } from '../../middleware/validate';
import type { LocationsService } from './locations.service';

const locationParams = z.object({ collectionId: uuid, locationId: uuid });

export function locationsRoutes(service: LocationsService, member: (min: Role) => RequestHandler) {
  const router = Router({ mergeParams: true });
  const collectionId = (res: Parameters<RequestHandler>[1]) => membershipOf(res).collectionId;

  router.get('/', member('keeper'), async (_req, res) => {
    res.json({ locations: await service.list(collectionId(res)) });
  });
  router.post('/', member('keeper'), validate({ body: locationInput }), async (_req, res) => {
    res
      .status(201)
      .json(await service.create(collectionId(res), input<LocationValues>(res, 'body')));
  });
  router.put('/order', member('keeper'), validate({ body: walkOrderBody }), async (_req, res) => {
    await service.reorder(
      collectionId(res),
      input<{ locationIds: string[] }>(res, 'body').locationIds,
    );
    res.json({ locations: await service.list(collectionId(res)) });
  });
  router.post(
    '/rename',
    member('keeper'),
    validate({ body: renameGroupBody }),
    async (_req, res) => {
      await service.renameGroup(collectionId(res), input<RenameGroupOutput>(res, 'body'));
      res.json({ locations: await service.list(collectionId(res)) });
    },
  );
  router.patch(
    '/:locationId',
    member('keeper'),
    validate({ params: locationParams, body: locationInput }),
    async (_req, res) => {
      res.json(
        await service.rename(
          collectionId(res),
          input<{ locationId: string }>(res, 'params').locationId,
          input<LocationValues>(res, 'body'),
        ),
      );
    },
  );
  router.delete(
    '/:locationId',
    member('keeper'),
    validate({ params: locationParams }),
    async (_req, res) => {
      await service.remove(
        collectionId(res),
        input<{ locationId: string }>(res, 'params').locationId,
      );
      res.status(204).end();
    },
  );
  return router;
}
