import { Router, type RequestHandler } from 'express';
import { z } from 'zod';
import type { Role } from '#shared/domain/roles';
import { uuid } from '#shared/schemas/common';
import {
  acceptBody,
  coverBody,
  coverChangeBody,
  generalNoteBody,
  handoverNoteBody,
  inviteToken,
  type AcceptBody,
} from '#shared/schemas/cover';
import { currentUserId } from '../../middleware/auth';
import { HttpError } from '../../middleware/errors';
import { membershipOf } from '../../middleware/roles';
import { startSession } from '../../middleware/session';
import { input, validate } from '../../middleware/validate';
import type { AuthService } from '../auth/auth.service';
import type { RoundsService } from '../rounds/rounds.service';
import type { CoverReportsService } from './cover-reports.service';
import type { CoverService } from './cover.service';

const coverParams = z.object({ collectionId: uuid, coverId: uuid });
const noteParams = z.object({ collectionId: uuid, noteId: uuid });

type Member = (min: Role, options?: { anyTime?: boolean }) => RequestHandler;

// A keeper or owner has no cover of their own to read, acknowledge or leave.
const onlyHelpers: RequestHandler = (_req, res, next) => {
  if (membershipOf(res).role !== 'helper')
    return next(
      new HttpError(404, 'not_found', 'You keep this collection; there is no cover of yours here.'),
    );
  next();
};

/**
 * Owners arrange covers; keepers write handover notes; a helper reads their own cover.
 * `inviteLimit` counts the invites a collection sends (each mails the owner's words anywhere).
 */
export function coverRoutes(
  cover: CoverService,
  reports: CoverReportsService,
  rounds: RoundsService,
  member: Member,
  inviteLimit: RequestHandler,
) {
  const router = Router({ mergeParams: true });
  const collectionId = (res: Parameters<RequestHandler>[1]) => membershipOf(res).collectionId;

  router.get('/covers', member('owner'), async (_req, res) => {
    res.json({ covers: await cover.covers.list(membershipOf(res)) });
  });
  router.post(
    '/covers',
    member('owner'),
    validate({ body: coverBody }),
    inviteLimit,
    async (req, res) => {
      res
        .status(201)
        .json(await cover.covers.create(membershipOf(res), currentUserId(req), input(res, 'body')));
    },
  );
  router.put(
    '/covers/:coverId',
    member('owner'),
    validate({ params: coverParams, body: coverChangeBody }),
    async (_req, res) => {
      await cover.covers.change(
        membershipOf(res),
        input<{ coverId: string }>(res, 'params').coverId,
        input(res, 'body'),
      );
      res.json({ covers: await cover.covers.list(membershipOf(res)) });
    },
  );
  // A new link for a cover not yet accepted (the earlier one stops working).
  router.post(
    '/covers/:coverId/resend',
    member('owner'),
    validate({ params: coverParams }),
    inviteLimit,
    async (req, res) => {
      await cover.covers.resend(
        membershipOf(res),
        currentUserId(req),
        input<{ coverId: string }>(res, 'params').coverId,
      );
      res.status(202).json({ covers: await cover.covers.list(membershipOf(res)) });
    },
  );
  router.post(
    '/covers/:coverId/end',
    member('owner'),
    validate({ params: coverParams }),
    async (_req, res) => {
      await cover.covers.end(collectionId(res), input<{ coverId: string }>(res, 'params').coverId);
      res.json({ covers: await cover.covers.list(membershipOf(res)) });
    },
  );

  router.get('/handover', member('keeper'), async (_req, res) => {
    res.json(await cover.handover.current(membershipOf(res)));
  });
  router.put(
    '/handover/general',
    member('keeper'),
    validate({ body: generalNoteBody }),
    async (_req, res) => {
      await cover.handover.setGeneralNote(
        collectionId(res),
        input<{ text: string }>(res, 'body').text,
      );
      res.status(204).end();
    },
  );
  router.post(
    '/handover/notes',
    member('keeper'),
    validate({ body: handoverNoteBody }),
    async (req, res) => {
      const body = input<{ animalId: string; text: string; until: string; doNotFeed: boolean }>(
        res,
        'body',
      );
      const created = await cover.handover.add(collectionId(res), currentUserId(req), body);
      // A do-not-feed note withdraws today's open feed task at once (R18).
      if (body.doNotFeed) await rounds.reconcileToday(collectionId(res), [body.animalId]);
      res.status(201).json(created);
    },
  );
  router.delete(
    '/handover/notes/:noteId',
    member('keeper'),
    validate({ params: noteParams }),
    async (_req, res) => {
      const animalId = await cover.handover.remove(
        collectionId(res),
        input<{ noteId: string }>(res, 'params').noteId,
      );
      await rounds.reconcileToday(collectionId(res), [animalId]);
      res.status(204).end();
    },
  );

  router.get('/cover-reports', member('keeper'), async (_req, res) => {
    res.json({ reports: await reports.list(collectionId(res)) });
  });

  // The helper's own cover: only while it runs (the membership check says when it does not).
  router.get('/cover/mine', member('helper'), onlyHelpers, async (req, res) => {
    const m = membershipOf(res);
    const round = await rounds.todayRound(m.collectionId);
    res.json(
      await cover.helper.view(
        m,
        currentUserId(req),
        round.items.map((i) => i.animal.id),
      ),
    );
  });
  router.post('/cover/mine/acknowledge', member('helper'), onlyHelpers, async (req, res) => {
    await cover.helper.acknowledgeSafety(collectionId(res), currentUserId(req));
    res.status(204).end();
  });
  // Leaving works before, during and after the cover.
  router.delete(
    '/cover/mine',
    member('helper', { anyTime: true }),
    onlyHelpers,
    async (req, res) => {
      await cover.helper.leave(collectionId(res), currentUserId(req));
      res.status(204).end();
    },
  );

  return router;
}

/** The invite link, before and at acceptance: no collection membership yet. */
export function coverInviteRoutes(cover: CoverService, auth: AuthService, limit: RequestHandler) {
  const router = Router();
  router.get(
    '/preview',
    limit,
    validate({ query: z.object({ token: inviteToken }) }),
    async (_req, res) => {
      res.json(await cover.invites.preview(input<{ token: string }>(res, 'query').token));
    },
  );
  router.post('/accept', limit, validate({ body: acceptBody }), async (req, res) => {
    const { userId, collectionId } = await cover.invites.accept(
      input<AcceptBody>(res, 'body'),
      req.session.userId ?? null,
    );
    await startSession(req, userId);
    res.json({ collectionId, me: await auth.me(userId) });
  });
  return router;
}
