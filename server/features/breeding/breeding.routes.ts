import { Router, type RequestHandler } from 'express';
import { z } from 'zod';
import type { Role } from '#shared/domain/roles';
import {
  eggSacBody,
  eggSacChange,
  incubationBody,
  slingsBody,
  type SlingsBody,
} from '#shared/schemas/breeding';
import { uuid } from '#shared/schemas/common';
import { currentUserId } from '../../middleware/auth';
import { membershipOf } from '../../middleware/roles';
import { input, validate } from '../../middleware/validate';
import type { BreedingService } from './breeding.service';

const sacParams = z.object({ collectionId: uuid, sacId: uuid });

/** Breeding records are keepers' work. */
export function breedingRoutes(service: BreedingService, member: (min: Role) => RequestHandler) {
  const router = Router({ mergeParams: true });
  const collectionId = (res: Parameters<RequestHandler>[1]) => membershipOf(res).collectionId;

  router.get('/egg-sacs', member('keeper'), async (_req, res) => {
    res.json({ sacs: await service.list(collectionId(res)) });
  });
  router.post('/egg-sacs', member('keeper'), validate({ body: eggSacBody }), async (req, res) => {
    res
      .status(201)
      .json(await service.create(membershipOf(res), currentUserId(req), input(res, 'body')));
  });
  router.patch(
    '/egg-sacs/:sacId',
    member('keeper'),
    validate({ params: sacParams, body: eggSacChange }),
    async (req, res) => {
      await service.change(
        membershipOf(res),
        currentUserId(req),
        input<{ sacId: string }>(res, 'params').sacId,
        input(res, 'body'),
      );
      res.json({ sacs: await service.list(collectionId(res)) });
    },
  );
  router.post(
    '/egg-sacs/:sacId/slings',
    member('keeper'),
    validate({ params: sacParams, body: slingsBody }),
    async (_req, res) => {
      const ids = await service.createSlings(
        membershipOf(res),
        input<{ sacId: string }>(res, 'params').sacId,
        input<SlingsBody>(res, 'body'),
      );
      res.status(201).json({ animalIds: ids });
    },
  );
  router.put(
    '/incubation',
    member('keeper'),
    validate({ body: incubationBody }),
    async (_req, res) => {
      const { minDays, maxDays } = input<{ minDays: number; maxDays: number }>(res, 'body');
      await service.setIncubation(collectionId(res), minDays, maxDays);
      res.status(204).end();
    },
  );
  return router;
}
