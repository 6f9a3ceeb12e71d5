import { Router, type RequestHandler } from 'express';
import { z } from 'zod';
import type { Role } from '#shared/domain/roles';
import {
  animalInput,
  moveBody,
  retireBody,
  type AnimalValues,
  type MoveBody,
} from '#shared/schemas/animals';
import { uuid } from '#shared/schemas/common';
import { currentUserId } from '../../middleware/auth';
import { membershipOf } from '../../middleware/roles';
import { input, validate } from '../../middleware/validate';
import type { AnimalsService } from './animals.service';

const animalParams = z.object({ collectionId: uuid, animalId: uuid });
const reinstateBody = z.object({
  note: z.string().trim().max(500, { message: 'Keep the note under 500 characters.' }).optional(),
});

/** Reading and editing the collection's records is keepers' work; helpers see the round only. */
export function animalsRoutes(service: AnimalsService, member: (min: Role) => RequestHandler) {
  const router = Router({ mergeParams: true });
  const collectionId = (res: Parameters<RequestHandler>[1]) => membershipOf(res).collectionId;

  router.get('/', member('keeper'), async (_req, res) => {
    res.json({ animals: await service.list(collectionId(res)) });
  });

  router.post('/', member('keeper'), validate({ body: animalInput }), async (_req, res) => {
    res.status(201).json(await service.create(membershipOf(res), input<AnimalValues>(res, 'body')));
  });

  router.post('/move', member('keeper'), validate({ body: moveBody }), async (req, res) => {
    res.json({
      moved: await service.move(
        membershipOf(res),
        currentUserId(req),
        input<MoveBody>(res, 'body'),
      ),
    });
  });

  router.get(
    '/:animalId',
    member('keeper'),
    validate({ params: animalParams }),
    async (_req, res) => {
      res.json(
        await service.get(collectionId(res), input<{ animalId: string }>(res, 'params').animalId),
      );
    },
  );

  router.put(
    '/:animalId',
    member('keeper'),
    validate({ params: animalParams, body: animalInput }),
    async (req, res) => {
      const { animalId } = input<{ animalId: string }>(res, 'params');
      res.json(
        await service.update(
          membershipOf(res),
          animalId,
          currentUserId(req),
          input<AnimalValues>(res, 'body'),
        ),
      );
    },
  );

  router.post(
    '/:animalId/retire',
    member('keeper'),
    validate({ params: animalParams, body: retireBody }),
    async (req, res) => {
      const { animalId } = input<{ animalId: string }>(res, 'params');
      res.json(
        await service.retire(membershipOf(res), animalId, currentUserId(req), input(res, 'body')),
      );
    },
  );

  router.post(
    '/:animalId/reinstate',
    member('keeper'),
    validate({ params: animalParams, body: reinstateBody }),
    async (req, res) => {
      const { animalId } = input<{ animalId: string }>(res, 'params');
      const { note } = input<{ note?: string }>(res, 'body');
      res.json(
        await service.setStatus(membershipOf(res), animalId, currentUserId(req), {
          status: 'active',
          date: null,
          note,
        }),
      );
    },
  );

  return router;
}
