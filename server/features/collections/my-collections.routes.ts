import { Router } from 'express';
import { requireUser } from '../../middleware/auth';
import type { AuthService } from '../auth/auth.service';

/** Mounted on /collections: the signed-in person's collections, with their role in each. */
export function myCollectionsRoutes(auth: Pick<AuthService, 'me'>) {
  const router = Router();
  router.get('/', requireUser, async (req, res) => {
    res.json({ memberships: (await auth.me(req.session.userId!)).memberships });
  });
  return router;
}
