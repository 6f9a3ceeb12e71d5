import { Router, type RequestHandler } from 'express';
import { z } from 'zod';
import type { Role } from '#shared/domain/roles';
import { uuid } from '#shared/schemas/common';
import { eventBatchBody, type EventBatchBody } from '#shared/schemas/events';
import { currentUserId } from '../../middleware/auth';
import { requireSameSiteWrite } from '../../middleware/csrf';
import { membershipOf } from '../../middleware/roles';
import type { SessionMemberCheck } from '../../middleware/session-member';
import { input, validate } from '../../middleware/validate';
import type { EventsService } from './events.service';

const historyQuery = z.object({
  animalId: uuid,
  limit: z.coerce.number().int().min(1).max(2000).default(50),
});

export function eventsRoutes(
  service: EventsService,
  member: (min: Role, options?: { anyTime?: boolean }) => RequestHandler,
) {
  const router = Router({ mergeParams: true });

  // A helper may sync after the cover ends, so the taps of a phone that was offline get their
  // verdicts: up to the grace after the end, those made during the cover are stored
  // (shared/domain/helper-writes.ts); later, or after an owner ended it, each is refused.
  router.post(
    '/',
    member('helper', { anyTime: true }),
    validate({ body: eventBatchBody }),
    async (req, res) => {
      res.json(
        await service.recordBatch(
          membershipOf(res),
          currentUserId(req),
          input<EventBatchBody>(res, 'body'),
        ),
      );
    },
  );

  router.get('/', member('keeper'), validate({ query: historyQuery }), async (_req, res) => {
    const { animalId, limit } = input<z.infer<typeof historyQuery>>(res, 'query');
    res.json({ events: await service.history(membershipOf(res).collectionId, animalId, limit) });
  });

  return router;
}

/**
 * POST /collections/:collectionId/events ahead of the session middleware (P5, P7): phones sync
 * batches all through a round. The same-site check, then the session and membership in one
 * query (`sessionMemberCheck`, as `member('helper', { anyTime: true })`), then the body as the
 * route validates it; anything but a pass goes on to the full stack and the route above, which
 * answers it as always (401, 403, 404, 422).
 */
export function syncFastPath(service: EventsService, check: SessionMemberCheck) {
  const router = Router();
  router.post('/collections/:collectionId/events', async (req, res, next) => {
    let sameSite = false;
    requireSameSiteWrite(req, res, (err?: unknown) => {
      sameSite = !err;
    });
    if (!sameSite) return next();
    const body = eventBatchBody.safeParse(req.body);
    if (!body.success) return next();
    const m = await check(req, 'helper', { anyTime: true });
    if (!m) return next();
    res.json(await service.recordBatch(m, m.userId, body.data));
  });
  return router;
}
