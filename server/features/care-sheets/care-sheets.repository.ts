import { and, asc, eq, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { animals, eggSacs, events } from '../../db/schema/animals';

/** The facts a care sheet shows (never the animal's place, label code or private notes). */
export async function sheetAnimal(db: Db, collectionId: string, animalId: string) {
  const [row] = await db
    .select({
      name: animals.name,
      scientificName: animals.scientificName,
      commonName: animals.commonName,
      group: animals.group,
      lifeStage: animals.lifeStage,
      sex: animals.sex,
      sizeMm: animals.sizeMm,
      cautions: animals.cautions,
      cautionNote: animals.cautionNote,
      hasWaterDish: animals.hasWaterDish,
      intervalDays: animals.intervalDays,
      preyType: animals.preyType,
      preySize: animals.preySize,
      preyCount: animals.preyCount,
      diet: animals.diet,
      mistEveryDays: animals.mistEveryDays,
      moistenEveryDays: animals.moistenEveryDays,
      fromOwnSac: sql<boolean>`exists (select 1 from ${eggSacs} where ${eggSacs.collectionId} = ${animals.collectionId} and ${eggSacs.clutch} = ${animals.clutch})`,
    })
    .from(animals)
    .where(and(eq(animals.collectionId, collectionId), eq(animals.id, animalId)));
  return row ?? null;
}

/** The animal's whole event log, oldest first. */
export function animalEvents(db: Db, collectionId: string, animalId: string) {
  return db
    .select({
      id: events.id,
      kind: events.kind,
      payload: events.payload,
      effectiveAt: events.effectiveAt,
    })
    .from(events)
    .where(and(eq(events.collectionId, collectionId), eq(events.animalId, animalId)))
    .orderBy(asc(events.effectiveAt), asc(events.id));
}
