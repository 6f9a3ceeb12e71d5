import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import { compareLocations } from '../../../shared/domain/walk-order';
import { toLocationSummary, type AnimalSummary } from '../../../shared/schemas/animals';
import type { CareSettingsBody } from '../../../shared/schemas/rules';
import { HttpError } from '../../middleware/errors';
import { listAnimals, updateAnimalCare } from './animals.repository';

export function createAnimalsService(db: NodePgDatabase) {
  return {
    async list(collectionId: string): Promise<AnimalSummary[]> {
      const rows = await listAnimals(db, collectionId);
      const summaries = rows.map(({ animal: a, location: l }) => ({
        id: a.id,
        labelCode: a.labelCode,
        name: a.name,
        scientificName: a.scientificName,
        commonName: a.commonName,
        group: a.group,
        lifeStage: a.lifeStage,
        sex: a.sex,
        sizeMm: a.sizeMm,
        status: a.status,
        cautions: a.cautions as AnimalSummary['cautions'],
        location: toLocationSummary(l),
        hasWaterDish: a.hasWaterDish,
        intervalDays: a.intervalDays,
        preyType: a.preyType,
        preySize: a.preySize,
        preyCount: a.preyCount,
        doNotFeedUntil: a.doNotFeedUntil,
      }));
      return summaries.sort((x, y) => compareLocations(x.location, y.location) || x.labelCode.localeCompare(y.labelCode));
    },

    /** The care settings the round engine honours for one animal (interval, offer, dish…). */
    async updateCare(collectionId: string, animalId: string, body: CareSettingsBody) {
      if (!(await updateAnimalCare(db, collectionId, animalId, body))) {
        throw new HttpError(404, 'not_found', 'We could not find that animal.');
      }
    },
  };
}
export type AnimalsService = ReturnType<typeof createAnimalsService>;
