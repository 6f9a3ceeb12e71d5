import { Router, type RequestHandler } from 'express';
import type { Role } from '#shared/domain/roles';
import { helperReportBody, type HelperReportBody } from '#shared/schemas/helper-reports';
import { currentUserId } from '../../middleware/auth';
import { membershipOf } from '../../middleware/roles';
import { input, validate } from '../../middleware/validate';
import type { HelperReportsService } from './helper-reports.service';

/**
 * Mounted on /helper-reports: a helper reports while the cover runs (keepers may too); the
 * owners read them.
 */
export function helperReportsRoutes(
  service: HelperReportsService,
  member: (min: Role) => RequestHandler,
) {
  const router = Router({ mergeParams: true });
  router.post('/', member('helper'), validate({ body: helperReportBody }), async (req, res) => {
    res
      .status(201)
      .json(
        await service.report(
          membershipOf(res),
          currentUserId(req),
          input<HelperReportBody>(res, 'body'),
        ),
      );
  });
  router.get('/', member('owner'), async (_req, res) => {
    res.json({ reports: await service.list(membershipOf(res).collectionId) });
  });
  return router;
}
