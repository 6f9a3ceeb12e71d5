import express, { Router, type RequestHandler } from 'express';
import type { Role } from '../../../shared/domain/roles';
import { backupFile, type BackupFile } from '../../../shared/schemas/backup';
import { animalImportBody } from '../../../shared/schemas/import';
import type { AnimalImportValues } from '../../../shared/schemas/import';
import { membershipOf } from '../../middleware/roles';
import { input, validate } from '../../middleware/validate';
import type { DataService } from './data.service';

/** Requests whose bodies may be large; parsed only after the membership check (see app.ts). */
export const LARGE_BODY_PATHS = /^\/collections\/[^/]+\/(restore|animals\/import)\/?$/;
const largeJson = (limit: string) => express.json({ limit });

const download = (res: Parameters<RequestHandler>[1], type: string, name: string, body: string) =>
  res.type(type).set('Content-Disposition', `attachment; filename="${name}"`).set('Cache-Control', 'no-store').send(body);

/** The keeper's data in and out: CSV both ways, and the whole collection as one JSON file. */
export function dataRoutes(service: DataService, member: (min: Role) => RequestHandler) {
  const router = Router({ mergeParams: true });
  const collectionId = (res: Parameters<RequestHandler>[1]) => membershipOf(res).collectionId;
  const day = () => new Date().toISOString().slice(0, 10);

  router.get('/export/animals.csv', member('keeper'), async (_req, res) => {
    download(res, 'text/csv; charset=utf-8', `rackside-animals-${day()}.csv`, await service.animalsCsv(collectionId(res)));
  });

  router.get('/export/events.csv', member('keeper'), async (_req, res) => {
    download(res, 'text/csv; charset=utf-8', `rackside-events-${day()}.csv`, await service.eventsCsv(collectionId(res)));
  });

  router.post('/animals/import', member('keeper'), largeJson('20mb'), validate({ body: animalImportBody }), async (_req, res) => {
    const { rows } = input<{ rows: AnimalImportValues[] }>(res, 'body');
    res.status(201).json({ imported: await service.importAnimals(collectionId(res), rows) });
  });

  router.get('/backup', member('keeper'), async (_req, res) => {
    download(res, 'application/json', `rackside-backup-${day()}.json`, JSON.stringify(await service.backup(collectionId(res))));
  });

  // Restoring fills a collection, so only its owner may.
  router.post('/restore', member('owner'), largeJson('200mb'), validate({ body: backupFile }), async (_req, res) => {
    res.status(201).json(await service.restore(collectionId(res), input<BackupFile>(res, 'body')));
  });

  return router;
}
