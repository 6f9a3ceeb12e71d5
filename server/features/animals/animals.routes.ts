import { Router, type RequestHandler } from 'express';
import type { Role } from '../../../shared/domain/roles';
import { membershipOf } from '../../middleware/roles';
import type { AnimalsService } from './animals.service';

export function animalsRoutes(service: AnimalsService, member: (min: Role) => RequestHandler) {
  const router = Router({ mergeParams: true });
  router.get('/', member('keeper'), async (_req, res) => {
    res.json({ animals: await service.list(membershipOf(res).collectionId) });
  });
  return router;
}
