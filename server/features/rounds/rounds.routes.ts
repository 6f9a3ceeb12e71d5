import { Router, type Request, type RequestHandler, type Response } from 'express';
import { z } from 'zod';
import type { Role } from '#shared/domain/roles';
import { localDate, uuid } from '#shared/schemas/common';
import { careSettingsBody, type CareSettingsBody } from '#shared/schemas/rules';
import { membershipOf } from '../../middleware/roles';
import type { SessionMemberCheck } from '../../middleware/session-member';
import { input, validate } from '../../middleware/validate';
import type { SerialisedRound } from './round-cache';
import type { RoundsService } from './rounds.service';

type Member = (min: Role) => RequestHandler;
const collectionId = (res: Parameters<RequestHandler>[1]) => membershipOf(res).collectionId;

/** Mounted on /collections/:collectionId/rounds. */
export function roundsRoutes(rounds: RoundsService, member: Member) {
  const router = Router({ mergeParams: true });

  // Helpers may read today's round during their cover; everything else is for keepers.
  router.get('/today', member('helper'), async (req, res) => {
    const m = membershipOf(res);
    sendTodayRound(req, res, await rounds.todayRoundSerialised(m.collectionId, m.revision));
  });

  router.get('/tomorrow', member('keeper'), async (_req, res) => {
    res.json(await rounds.tomorrowPreview(collectionId(res)));
  });

  // What a keeper's phone needs to build the next days itself with no signal (decision 015).
  // Helpers are not sent it: it describes every animal, and their cover is today's round.
  // It changes only with the collection's counters and its local date: 304 while they stand.
  router.get('/engine-input', member('keeper'), async (req, res) => {
    const m = membershipOf(res);
    const etag = `"engine-${m.revision.records}-${m.revision.events}-${rounds.today(m)}"`;
    res.setHeader('Cache-Control', 'private, no-cache');
    res.setHeader('ETag', etag);
    if (req.fresh) return void res.status(304).end();
    res.json(await rounds.engineInputFor(m.collectionId));
  });

  return router;
}

/** Today's round as the cache holds it: the same bytes and ETag for every member. */
function sendTodayRound(req: Request, res: Response, round: SerialisedRound) {
  // Always revalidated (the round changes with every tap), answered 304 while unchanged.
  res.setHeader('Cache-Control', 'private, no-cache');
  res.setHeader('ETag', round.etag);
  res.vary('Accept-Encoding');
  res.type('application/json');
  if (req.fresh) return void res.status(304).end();
  if (req.acceptsEncodings('gzip', 'identity') === 'gzip') {
    res.setHeader('Content-Encoding', 'gzip');
    return void res.send(round.gzip());
  }
  res.send(round.json);
}

/**
 * GET /collections/:collectionId/rounds/today ahead of the session and JSON middleware (P7):
 * phones poll it all day. The session and membership are checked with one query
 * (`sessionMemberCheck`, the same rules as `member('helper')`); anything but a pass goes on to
 * the full stack and the route above, which answers it as always.
 */
export function todayRoundFastPath(
  rounds: Pick<RoundsService, 'todayRoundSerialised'>,
  check: SessionMemberCheck,
) {
  const router = Router();
  router.get('/collections/:collectionId/rounds/today', async (req, res, next) => {
    const m = await check(req, 'helper');
    if (!m) return next();
    sendTodayRound(req, res, await rounds.todayRoundSerialised(m.collectionId, m.revision));
  });
  return router;
}

/** Mounted on /collections/:collectionId/prep-list. */
export function prepListRoutes(rounds: RoundsService, member: Member) {
  const router = Router({ mergeParams: true });
  router.get(
    '/',
    member('keeper'),
    validate({ query: z.object({ date: localDate }) }),
    async (_req, res) => {
      res.json({
        prepList: await rounds.prepList(
          collectionId(res),
          input<{ date: string }>(res, 'query').date,
        ),
      });
    },
  );
  return router;
}

const animalParams = z.object({ collectionId: uuid, animalId: uuid });

/**
 * Mounted on /collections/:collectionId/animals/:animalId: an animal's place in the round.
 * `updateCare` stores its care settings (the animals feature owns the record).
 */
export function animalScheduleRoutes(
  rounds: RoundsService,
  updateCare: (collectionId: string, animalId: string, body: CareSettingsBody) => Promise<void>,
  member: Member,
) {
  const router = Router({ mergeParams: true });

  router.get(
    '/schedule',
    member('keeper'),
    validate({ params: animalParams }),
    async (_req, res) => {
      res.json(
        await rounds.schedule(
          collectionId(res),
          input<{ animalId: string }>(res, 'params').animalId,
        ),
      );
    },
  );

  router.patch(
    '/care',
    member('keeper'),
    validate({ params: animalParams, body: careSettingsBody }),
    async (_req, res) => {
      const { animalId } = input<{ animalId: string }>(res, 'params');
      await updateCare(collectionId(res), animalId, input<CareSettingsBody>(res, 'body'));
      // A keeper's hold set or lifted today changes today's feed task at once (R18).
      await rounds.reconcileToday(collectionId(res), [animalId]);
      res.json(await rounds.schedule(collectionId(res), animalId));
    },
  );

  return router;
}
