import { Router, type RequestHandler } from 'express';
import type { Role } from '#shared/domain/roles';
import { collectionParams } from '#shared/schemas/common';
import { availabilityBody, availableParams, type AvailabilityBody } from '#shared/schemas/listings';
import { membershipOf } from '../../middleware/roles';
import { input, validate } from '../../middleware/validate';
import { notPublished, type AvailabilityService } from './availability.service';

/** Mounted on /collections/:collectionId/availability: owners and keepers only. */
export function availabilityRoutes(
  service: AvailabilityService,
  member: (min: Role) => RequestHandler,
) {
  const router = Router({ mergeParams: true });

  router.get('/', member('keeper'), validate({ params: collectionParams }), async (_req, res) => {
    res.set('Cache-Control', 'no-store').json(await service.settings(membershipOf(res)));
  });

  router.put(
    '/',
    member('keeper'),
    validate({ params: collectionParams, body: availabilityBody }),
    async (_req, res) => {
      res.json(await service.save(membershipOf(res), input<AvailabilityBody>(res, 'body')));
    },
  );

  router.post(
    '/new-link',
    member('keeper'),
    validate({ params: collectionParams }),
    async (_req, res) => {
      res.json(await service.newLink(membershipOf(res)));
    },
  );

  return router;
}

/**
 * Mounted on /available: the public list, no session. Shops may poll it: revalidated on every
 * read (ETag, so an unchanged list is a 304) so a retired link stops at once; the link kept out
 * of referrers and search engines; a per-address limit. A malformed link gets the same 404 as a
 * wrong or retired one.
 */
export function publicAvailabilityRoutes(service: AvailabilityService, limit: RequestHandler) {
  const router = Router({ mergeParams: true });
  const publicHeaders = (res: Parameters<RequestHandler>[1]) =>
    res.set({
      'Cache-Control': 'no-cache',
      'X-Robots-Tag': 'noindex, nofollow',
      'Referrer-Policy': 'no-referrer',
    });

  const tokenOf = (req: Parameters<RequestHandler>[0]) => {
    const parsed = availableParams.safeParse(req.params);
    if (!parsed.success) throw notPublished();
    return parsed.data.token;
  };

  router.get('/:token', limit, async (req, res) => {
    publicHeaders(res).json(await service.published(tokenOf(req)));
  });

  router.get('/:token/list.csv', limit, async (req, res) => {
    const { csv } = await service.publishedCsv(tokenOf(req));
    publicHeaders(res)
      .type('text/csv; charset=utf-8')
      .set('Content-Disposition', 'attachment; filename="available.csv"')
      .send(csv);
  });

  return router;
}
