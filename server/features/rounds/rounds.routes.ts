import { Router, type RequestHandler } from 'express';
import { z } from 'zod';
import type { Role } from '../../../shared/domain/roles';
import type { RulesOverride } from '../../../shared/domain/rounds/rules';
import { localDate, uuid } from '../../../shared/schemas/common';
import { careSettingsBody, rulesOverride, type CareSettingsBody } from '../../../shared/schemas/rules';
import { membershipOf } from '../../middleware/roles';
import { input, validate } from '../../middleware/validate';
import type { AnimalsService } from '../animals/animals.service';
import type { RoundsService } from './rounds.service';

const animalParams = z.object({ collectionId: uuid, animalId: uuid });

export function roundsRoutes(rounds: RoundsService, animals: AnimalsService, member: (min: Role) => RequestHandler) {
  const router = Router({ mergeParams: true });
  const collectionId = (res: Parameters<RequestHandler>[1]) => membershipOf(res).collectionId;

  // Helpers may read today's round during their cover; everything else is for keepers.
  router.get('/rounds/today', member('helper'), async (req, res) => {
    const m = membershipOf(res);
    const round = await rounds.todayRoundSerialised(m.collectionId, m.revision);
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
  });

  router.get('/rounds/tomorrow', member('keeper'), async (_req, res) => {
    res.json(await rounds.tomorrowPreview(collectionId(res)));
  });

  router.get('/prep-list', member('keeper'), validate({ query: z.object({ date: localDate }) }), async (_req, res) => {
    res.json({ prepList: await rounds.prepList(collectionId(res), input<{ date: string }>(res, 'query').date) });
  });

  router.get('/animals/:animalId/schedule', member('keeper'), validate({ params: animalParams }), async (_req, res) => {
    res.json(await rounds.schedule(collectionId(res), input<{ animalId: string }>(res, 'params').animalId));
  });

  router.patch('/animals/:animalId/care', member('keeper'), validate({ params: animalParams, body: careSettingsBody }), async (_req, res) => {
    const { animalId } = input<{ animalId: string }>(res, 'params');
    await animals.updateCare(collectionId(res), animalId, input<CareSettingsBody>(res, 'body'));
    // A keeper's hold set or lifted today changes today's feed task at once (R18).
    await rounds.reconcileToday(collectionId(res), [animalId]);
    res.json(await rounds.schedule(collectionId(res), animalId));
  });

  router.get('/rules', member('keeper'), async (_req, res) => {
    res.json(await rounds.rules(collectionId(res)));
  });

  router.put('/rules', member('keeper'), validate({ body: rulesOverride }), async (_req, res) => {
    res.json(await rounds.replaceRules(collectionId(res), input<RulesOverride>(res, 'body')));
  });

  return router;
}
