import { Router, type RequestHandler } from 'express';
import type { Role } from '#shared/domain/roles';
import {
  colonyInput,
  colonyParams,
  countUpdateBody,
  type ColonyInput,
  type CountUpdateBody,
} from '#shared/schemas/colonies';
import { collectionParams } from '#shared/schemas/common';
import { membershipOf } from '../../middleware/roles';
import { input, validate } from '../../middleware/validate';
import type { ColoniesService } from './colonies.service';

/**
 * Mounted on /collections/:collectionId/colonies. Keepers and owners manage feeder colonies;
 * helpers see none of it (their cover is today's animals).
 */
export function coloniesRoutes(service: ColoniesService, member: (min: Role) => RequestHandler) {
  const router = Router({ mergeParams: true });
  const colonyId = (res: Parameters<RequestHandler>[1]) =>
    input<{ colonyId: string }>(res, 'params').colonyId;

  router.get('/', member('keeper'), validate({ params: collectionParams }), async (_req, res) => {
    res.json(await service.list(membershipOf(res)));
  });

  router.post(
    '/',
    member('keeper'),
    validate({ params: collectionParams, body: colonyInput }),
    async (_req, res) => {
      res
        .status(201)
        .json(await service.create(membershipOf(res), input<ColonyInput>(res, 'body')));
    },
  );

  router.put(
    '/:colonyId',
    member('keeper'),
    validate({ params: colonyParams, body: colonyInput }),
    async (_req, res) => {
      res.json(
        await service.update(membershipOf(res), colonyId(res), input<ColonyInput>(res, 'body')),
      );
    },
  );

  router.delete(
    '/:colonyId',
    member('keeper'),
    validate({ params: colonyParams }),
    async (_req, res) => {
      await service.remove(membershipOf(res), colonyId(res));
      res.status(204).end();
    },
  );

  router.post(
    '/:colonyId/counts',
    member('keeper'),
    validate({ params: colonyParams, body: countUpdateBody }),
    async (_req, res) => {
      res.json(
        await service.countUpdate(
          membershipOf(res),
          colonyId(res),
          input<CountUpdateBody>(res, 'body'),
        ),
      );
    },
  );

  router.get(
    '/:colonyId/history',
    member('keeper'),
    validate({ params: colonyParams }),
    async (_req, res) => {
      res.json(await service.history(membershipOf(res), colonyId(res)));
    },
  );

  return router;
}
