import { Router } from 'express';
import { newCollectionBody, type NewCollectionBody } from '#shared/schemas/collections';
import { currentUserId, requireUser } from '../../middleware/auth';
import { input, validate } from '../../middleware/validate';
import type { AuthService } from '../auth/auth.service';
import type { CollectionsService } from './collections.service';

/**
 * Mounted on /collections: the signed-in person's collections, with their role in each, and a
 * new one of their own.
 */
export function myCollectionsRoutes(
  auth: Pick<AuthService, 'me'>,
  collections: Pick<CollectionsService, 'create'>,
) {
  const router = Router();
  router.get('/', requireUser, async (req, res) => {
    res.json({ memberships: (await auth.me(req.session.userId!)).memberships });
  });
  router.post('/', requireUser, validate({ body: newCollectionBody }), async (req, res) => {
    res
      .status(201)
      .json(await collections.create(currentUserId(req), input<NewCollectionBody>(res, 'body')));
  });
  return router;
}
