import { Router, type RequestHandler } from 'express';
import { z } from 'zod';
import type { Role } from '#shared/domain/roles';
import {
  loggerImportBody,
  roomQuery,
  roomTargetsBody,
  type LoggerImportBody,
  type RoomTargetsInput,
} from '#shared/schemas/climate';
import { uuid } from '#shared/schemas/common';
import { currentUserId } from '../../middleware/auth';
import { membershipOf } from '../../middleware/roles';
import { input, validate } from '../../middleware/validate';
import type { ClimateService } from './climate.service';

const animalParams = z.object({ collectionId: uuid, animalId: uuid });

/**
 * Mounted on /climate. A covering helper reads today's rooms (they type the daily reading as a
 * room chore: POST /chores); targets, history, charts and logger imports are the keepers'.
 */
export function climateRoutes(service: ClimateService, member: (min: Role) => RequestHandler) {
  const router = Router({ mergeParams: true });
  router.get('/today', member('helper'), async (req, res) => {
    res.json(await service.today(membershipOf(res), currentUserId(req)));
  });
  router.get('/rooms', member('keeper'), async (_req, res) => {
    res.json(await service.rooms(membershipOf(res).collectionId));
  });
  router.put(
    '/targets',
    member('keeper'),
    validate({ body: roomTargetsBody }),
    async (_req, res) => {
      res.json(
        await service.setTargets(
          membershipOf(res).collectionId,
          input<RoomTargetsInput>(res, 'body'),
        ),
      );
    },
  );
  router.get('/history', member('keeper'), validate({ query: roomQuery }), async (_req, res) => {
    const q = input<{ room: string; days: number }>(res, 'query');
    res.json(await service.history(membershipOf(res), q.room, q.days));
  });
  router.post(
    '/import',
    member('keeper'),
    validate({ body: loggerImportBody }),
    async (_req, res) => {
      res.json(
        await service.importLogger(
          membershipOf(res).collectionId,
          input<LoggerImportBody>(res, 'body'),
        ),
      );
    },
  );
  router.get(
    '/animals/:animalId',
    member('keeper'),
    validate({ params: animalParams }),
    async (_req, res) => {
      res.json(
        await service.animalClimate(
          membershipOf(res),
          input<{ animalId: string }>(res, 'params').animalId,
        ),
      );
    },
  );
  return router;
}
