import express, { Router, type Request, type RequestHandler, type Response } from 'express';
import type { Role } from '#shared/domain/roles';
import { animalImportBody } from '#shared/schemas/import';
import type { AnimalImportValues } from '#shared/schemas/import';
import { HttpError } from '../../middleware/errors';
import { membershipOf } from '../../middleware/roles';
import { input, validate } from '../../middleware/validate';
import type { BackupSink } from './backup-writer';
import type { DataService } from './data.service';

/** Requests whose bodies may be large; parsed only after the membership check (see app.ts). */
export const LARGE_BODY_PATHS = /^\/collections\/[^/]+\/(restore|animals\/import)\/?$/;
const largeJson = (limit: string) => express.json({ limit });

/** A reader that takes nothing for this long has gone, and the backup's transaction ends. */
const STALLED_MS = 60_000;

const download = (res: Response, type: string, name: string) =>
  res
    .type(type)
    .set('Content-Disposition', `attachment; filename="${name}"`)
    .set('Cache-Control', 'no-store');

/**
 * The response as a sink for a long download: headers on the first write, then each write
 * waits for room. no-transform: sent as it is, not gzipped on the way (most of a large backup
 * is photos, which do not compress; it spares the shared CPU, and 'drain' comes straight from
 * the socket, where the compression middleware would leave listeners behind).
 */
function responseSink(res: Response, type: string, name: string): BackupSink {
  return {
    async write(text) {
      if (!res.headersSent)
        download(res.status(200), type, name).set('Cache-Control', 'no-store, no-transform');
      if (res.destroyed) throw new Error('The client closed the connection.');
      if (res.write(text)) return;
      await new Promise<void>((resolve, reject) => {
        let settled = false;
        const done = (err?: Error) => {
          if (settled) return;
          settled = true;
          clearTimeout(timer);
          res.off('close', onClose);
          if (err) reject(err);
          else resolve();
        };
        const onClose = () => done(new Error('The client closed the connection.'));
        const timer = setTimeout(() => done(new Error('The client stopped reading.')), STALLED_MS);
        res.once('drain', () => done());
        res.on('close', onClose);
      });
    },
  };
}

/** Asked to come back later: say when. */
function withRetryAfter(res: Response, err: unknown): never {
  if (err instanceof HttpError && err.code === 'busy') res.set('Retry-After', '30');
  throw err;
}

/** The keeper's data in and out: CSV both ways, and the whole collection as one JSON file. */
export function dataRoutes(service: DataService, member: (min: Role) => RequestHandler) {
  const router = Router({ mergeParams: true });
  const collectionId = (res: Response) => membershipOf(res).collectionId;
  const day = () => new Date().toISOString().slice(0, 10);

  router.get('/export/animals.csv', member('keeper'), async (_req, res) => {
    download(res, 'text/csv; charset=utf-8', `rackside-animals-${day()}.csv`).send(
      await service.animalsCsv(collectionId(res)),
    );
  });

  /** Runs a long download; an error after its first byte can only cut it short. */
  const streamed = (
    req: Request,
    res: Response,
    work: (sink: BackupSink) => Promise<void>,
    type: string,
    name: string,
  ) =>
    work(responseSink(res, type, name)).then(
      () => void res.end(),
      (err: unknown) => {
        if (!res.headersSent) withRetryAfter(res, err);
        req.log?.warn({ err }, 'download cut short');
        res.destroy();
      },
    );

  router.get('/export/events.csv', member('keeper'), async (req, res) => {
    await streamed(
      req,
      res,
      (sink) => service.eventsCsv(membershipOf(res), sink),
      'text/csv; charset=utf-8',
      `rackside-events-${day()}.csv`,
    );
  });

  router.post(
    '/animals/import',
    member('keeper'),
    largeJson('20mb'),
    validate({ body: animalImportBody }),
    async (_req, res) => {
      const { rows } = input<{ rows: AnimalImportValues[] }>(res, 'body');
      res.status(201).json({ imported: await service.importAnimals(membershipOf(res), rows) });
    },
  );

  // Streamed out as it is read; an error once the download has begun can only cut it short
  // (an unfinished JSON file, which a restore refuses), never pass for a whole backup.
  router.get('/backup', member('keeper'), async (req, res) => {
    await streamed(
      req,
      res,
      (sink) => service.backup(membershipOf(res), sink),
      'application/json',
      `rackside-backup-${day()}.json`,
    );
  });

  // Restoring fills a collection, so only its owner may. The body is read as a stream by the
  // service (never parsed whole), so the route takes the request itself.
  router.post('/restore', member('owner'), async (req, res) => {
    const declared = Number(req.headers['content-length']);
    try {
      res
        .status(201)
        .json(
          await service.restore(
            membershipOf(res),
            req,
            Number.isFinite(declared) ? declared : undefined,
          ),
        );
    } catch (err) {
      withRetryAfter(res, err);
    }
  });

  return router;
}
