import { Router, type ErrorRequestHandler, type RequestHandler } from 'express';
import multer from 'multer';
import { z } from 'zod';
import type { Role } from '#shared/domain/roles';
import { uuid } from '#shared/schemas/common';
import { HttpError } from '../../middleware/errors';
import { membershipOf } from '../../middleware/roles';
import { input, validate } from '../../middleware/validate';
import { MAX_PHOTO_BYTES, type PhotoSize, type PhotosService } from './photos.service';

const animalParams = z.object({ collectionId: uuid, animalId: uuid });
const photoQuery = z.object({
  size: z.enum(['full', 'thumb']).default('full'),
  v: z.string().max(40).optional(),
});

// Held in memory (10 MB at most), checked, re-encoded, and only then written to disk. The
// name is kept whole (preservePath) so a name reaching into folders is refused, not trimmed.
const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_PHOTO_BYTES, files: 1, fields: 0, parts: 2 },
  preservePath: true,
});

/** multer's own errors, in our words and status codes. */
const uploadErrors: ErrorRequestHandler = (err, _req, _res, next) => {
  if (err instanceof multer.MulterError) {
    if (err.code === 'LIMIT_FILE_SIZE')
      return next(
        new HttpError(
          413,
          'too_large',
          `Photos can be at most ${MAX_PHOTO_BYTES / 1024 / 1024} MB.`,
        ),
      );
    return next(new HttpError(400, 'bad_upload', 'Send one photo in the field “photo”.'));
  }
  // Anything else here came from reading the multipart body (busboy): a malformed upload.
  if (!(err instanceof HttpError))
    return next(
      new HttpError(
        400,
        'bad_upload',
        'The upload could not be read. Send one photo in the field “photo”.',
      ),
    );
  next(err);
};

/** Members of the collection see photos (helpers too, while they cover); keepers change them. */
export function photosRoutes(service: PhotosService, member: (min: Role) => RequestHandler) {
  const router = Router({ mergeParams: true });
  const collectionId = (res: Parameters<RequestHandler>[1]) => membershipOf(res).collectionId;

  const save: RequestHandler = async (req, res) => {
    res.json(
      await service.save(
        collectionId(res),
        input<{ animalId: string }>(res, 'params').animalId,
        req.file,
      ),
    );
  };
  router.put(
    '/animals/:animalId/photo',
    member('keeper'),
    validate({ params: animalParams }),
    upload.single('photo'),
    uploadErrors,
    save,
  );

  router.get(
    '/animals/:animalId/photo',
    member('helper'),
    validate({ params: animalParams, query: photoQuery }),
    async (_req, res) => {
      const { size } = input<{ size: PhotoSize }>(res, 'query');
      const file = await service.file(
        collectionId(res),
        input<{ animalId: string }>(res, 'params').animalId,
        size,
      );
      // The URL carries the photo's version, so a private cache may keep it.
      res.set('Cache-Control', 'private, max-age=86400').type('image/webp').sendFile(file);
    },
  );

  const moltParams = z.object({ collectionId: uuid, animalId: uuid, eventId: uuid });
  const saveMolt: RequestHandler = async (req, res) => {
    const { animalId, eventId } = input<{ animalId: string; eventId: string }>(res, 'params');
    await service.saveMolt(collectionId(res), animalId, eventId, req.file);
    res.status(204).end();
  };
  router.put(
    '/animals/:animalId/molts/:eventId/photo',
    member('keeper'),
    validate({ params: moltParams }),
    upload.single('photo'),
    uploadErrors,
    saveMolt,
  );
  router.get(
    '/animals/:animalId/molts/:eventId/photo',
    member('keeper'),
    validate({ params: moltParams, query: photoQuery }),
    async (_req, res) => {
      const { animalId, eventId } = input<{ animalId: string; eventId: string }>(res, 'params');
      const file = await service.moltFile(
        collectionId(res),
        animalId,
        eventId,
        input<{ size: PhotoSize }>(res, 'query').size,
      );
      res.set('Cache-Control', 'private, max-age=86400').type('image/webp').sendFile(file);
    },
  );

  // A photo with any outcome or note recorded at the rack (the molt's own route above stays).
  const saveEvent: RequestHandler = async (req, res) => {
    const { animalId, eventId } = input<{ animalId: string; eventId: string }>(res, 'params');
    await service.saveEventPhoto(collectionId(res), animalId, eventId, req.file);
    res.status(204).end();
  };
  router.put(
    '/animals/:animalId/events/:eventId/photo',
    member('keeper'),
    validate({ params: moltParams }),
    upload.single('photo'),
    uploadErrors,
    saveEvent,
  );
  router.get(
    '/animals/:animalId/events/:eventId/photo',
    member('keeper'),
    validate({ params: moltParams, query: photoQuery }),
    async (_req, res) => {
      const { animalId, eventId } = input<{ animalId: string; eventId: string }>(res, 'params');
      const file = await service.eventFile(
        collectionId(res),
        animalId,
        eventId,
        input<{ size: PhotoSize }>(res, 'query').size,
      );
      res.set('Cache-Control', 'private, max-age=86400').type('image/webp').sendFile(file);
    },
  );

  router.delete(
    '/animals/:animalId/photo',
    member('keeper'),
    validate({ params: animalParams }),
    async (_req, res) => {
      await service.remove(collectionId(res), input<{ animalId: string }>(res, 'params').animalId);
      res.status(204).end();
    },
  );

  return router;
}
