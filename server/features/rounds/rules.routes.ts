import { Router, type RequestHandler } from 'express';
import type { Role } from '#shared/domain/roles';
import type { RulesOverride } from '#shared/domain/rounds/rules';
import { rulesOverride } from '#shared/schemas/rules';
import { membershipOf } from '../../middleware/roles';
import { input, validate } from '../../middleware/validate';
import type { RoundsService } from './rounds.service';

/** Mounted on /collections/:collectionId/rules: the collection's round rules, for keepers. */
export function rulesRoutes(
  rounds: Pick<RoundsService, 'rules' | 'replaceRules'>,
  member: (min: Role) => RequestHandler,
) {
  const router = Router({ mergeParams: true });

  router.get('/', member('keeper'), async (_req, res) => {
    res.json(await rounds.rules(membershipOf(res).collectionId));
  });

  router.put('/', member('keeper'), validate({ body: rulesOverride }), async (_req, res) => {
    res.json(
      await rounds.replaceRules(membershipOf(res).collectionId, input<RulesOverride>(res, 'body')),
    );
  });

  return router;
}
