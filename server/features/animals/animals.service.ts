import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import { compareLocations } from '../../../shared/domain/walk-order';
import type { AnimalSummary } from '../../../shared/schemas/animals';
import type { CareSettingsBody } from '../../../shared/schemas/rules';
import { HttpError } from '../../middleware/errors';
import { toAnimalSummary } from './animal-summary';
import { listAnimals, updateAnimalCare } from './animals.repository';

export function createAnimalsService(db: NodePgDatabase) {
  return {
    async list(collectionId: string): Promise<AnimalSummary[]> {
      const rows = await listAnimals(db, collectionId);
      const summaries = rows.map(({ animal, location }) => toAnimalSummary(animal, location));
      return summaries.sort(
        (x, y) =>
          compareLocations(x.location, y.location) || x.labelCode.localeCompare(y.labelCode),
      );
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
