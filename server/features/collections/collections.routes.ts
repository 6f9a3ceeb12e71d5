import { Router, type RequestHandler } from 'express';
import type { Role } from '#shared/domain/roles';
import {
  addMemberBody,
  deleteCollectionBody,
  inviteParams,
  memberParams,
  type DeleteCollectionBody,
  type MemberInviteRole,
} from '#shared/schemas/collections';
import { currentUserId } from '../../middleware/auth';
import { membershipOf } from '../../middleware/roles';
import { input, validate } from '../../middleware/validate';
import type { CollectionsService } from './collections.service';

/** `inviteLimit` counts invites per collection; it runs after the membership and body checks. */
export function collectionsRoutes(
  service: CollectionsService,
  member: (min: Role) => RequestHandler,
  inviteLimit: RequestHandler,
) {
  const router = Router({ mergeParams: true });

  router.get('/', member('helper'), (_req, res) => {
    const m = membershipOf(res);
    res.json({ id: m.collectionId, name: m.collectionName, timeZone: m.timeZone, role: m.role });
  });

  // Only an owner, and only with the collection's name typed out (the app offers the backup first).
  router.delete(
    '/',
    member('owner'),
    validate({ body: deleteCollectionBody }),
    async (_req, res) => {
      await service.deleteCollection(
        membershipOf(res),
        input<DeleteCollectionBody>(res, 'body').confirmName,
      );
      res.status(204).end();
    },
  );

  router.get('/members', member('owner'), async (_req, res) => {
    res.json(await service.members(membershipOf(res).collectionId));
  });

  // An invite, never an addition: the person joins by accepting it (decision 012).
  router.post(
    '/members',
    member('owner'),
    validate({ body: addMemberBody }),
    inviteLimit,
    async (req, res) => {
      res
        .status(202)
        .json(
          await service.invite(
            membershipOf(res),
            currentUserId(req),
            input<{ email: string; role: MemberInviteRole }>(res, 'body'),
          ),
        );
    },
  );

  // An unanswered invite: a new link (the old one stops working), or cancelled.
  router.post(
    '/invites/:inviteId/resend',
    member('owner'),
    validate({ params: inviteParams }),
    inviteLimit,
    async (req, res) => {
      res
        .status(202)
        .json(
          await service.resendInvite(
            membershipOf(res),
            currentUserId(req),
            input<{ inviteId: string }>(res, 'params').inviteId,
          ),
        );
    },
  );
  router.delete(
    '/invites/:inviteId',
    member('owner'),
    validate({ params: inviteParams }),
    async (_req, res) => {
      await service.revokeInvite(
        membershipOf(res).collectionId,
        input<{ inviteId: string }>(res, 'params').inviteId,
      );
      res.status(204).end();
    },
  );

  // A keeper may leave; helpers leave their cover at /cover/mine.
  router.delete('/membership', member('keeper'), async (req, res) => {
    const m = membershipOf(res);
    await service.leave(m.collectionId, currentUserId(req), m.role);
    res.status(204).end();
  });

  router.delete(
    '/members/:userId',
    member('owner'),
    validate({ params: memberParams }),
    async (req, res) => {
      const { userId } = input<{ userId: string }>(res, 'params');
      await service.removeMember(membershipOf(res).collectionId, userId, currentUserId(req));
      res.status(204).end();
    },
  );

  return router;
}
