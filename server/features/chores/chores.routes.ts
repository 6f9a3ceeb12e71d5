import { Router, type RequestHandler } from 'express';
import type { Role } from '#shared/domain/roles';
import { choreBatchBody, type ChoreBatchBody } from '#shared/schemas/chores';
import { currentUserId } from '../../middleware/auth';
import { membershipOf } from '../../middleware/roles';
import { input, validate } from '../../middleware/validate';
import type { ChoresService } from './chores.service';

/** Mounted on /collections/:collectionId/chores: a phone's batch of chores. */
export function choresRoutes(
  service: ChoresService,
  member: (min: Role, options?: { anyTime?: boolean }) => RequestHandler,
) {
  const router = Router({ mergeParams: true });
  // A covering helper records a room's reading (they are in the room) but no colony care: each
  // chore is judged on its own (`CHORE_SUBJECTS[…].helpers`), refused with words. As with the
  // round's taps, a helper may sync after the cover ends: a chore made during it is still
  // stored within the grace, any other is refused (shared/domain/helper-writes.ts).
  router.post(
    '/',
    member('helper', { anyTime: true }),
    validate({ body: choreBatchBody }),
    async (req, res) => {
      res.json(
        await service.recordBatch(
          membershipOf(res),
          currentUserId(req),
          input<ChoreBatchBody>(res, 'body'),
        ),
      );
    },
  );
  return router;
}
