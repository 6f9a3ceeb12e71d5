import { Router, type RequestHandler } from 'express';
import type { Role } from '#shared/domain/roles';
import { choreBatchBody, type ChoreBatchBody } from '#shared/schemas/chores';
import { currentUserId } from '../../middleware/auth';
import { membershipOf } from '../../middleware/roles';
import { input, validate } from '../../middleware/validate';
import type { ChoresService } from './chores.service';

/** Mounted on /collections/:collectionId/chores: a phone's batch of chores. */
export function choresRoutes(service: ChoresService, member: (min: Role) => RequestHandler) {
  const router = Router({ mergeParams: true });
  // Colony care is for keepers; helpers see none of it (a subject kind a helper may tend
  // would open this to them per kind: decision 020).
  router.post('/', member('keeper'), validate({ body: choreBatchBody }), async (req, res) => {
    res.json(
      await service.recordBatch(
        membershipOf(res),
        currentUserId(req),
        input<ChoreBatchBody>(res, 'body'),
      ),
    );
  });
  return router;
}
