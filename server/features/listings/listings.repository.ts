import { and, asc, eq, inArray, isNotNull, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { animals, eggSacs } from '../../db/schema/animals';
import { saleAnimals, saleListings } from '../../db/schema/sales';

/** In an unreleased sale (reserved, or sold and not yet retired). */
const inLiveSale = sql<boolean>`exists (select 1 from ${saleAnimals} where ${saleAnimals.animalId} = ${animals.id} and ${saleAnimals.releasedAt} is null)`;

/** From an egg sac of this collection: its clutch name is one of the collection's sacs. */
const fromOwnSac = sql<boolean>`exists (select 1 from ${eggSacs} where ${eggSacs.collectionId} = ${animals.collectionId} and ${eggSacs.clutch} = ${animals.clutch})`;

/** Molts recorded for the animal, leaving out any that were undone. */
const moltCount = sql<number>`(select count(*)::int from events m where m.animal_id = ${animals.id} and m.kind = 'molted' and not exists (select 1 from events v where v.animal_id = m.animal_id and v.kind = 'void' and v.payload->>'targetId' = m.id::text))`;

const listingFields = {
  animalId: animals.id,
  name: animals.name,
  labelCode: animals.labelCode,
  scientificName: animals.scientificName,
  commonName: animals.commonName,
  group: animals.group,
  lifeStage: animals.lifeStage,
  sex: animals.sex,
  sizeMm: animals.sizeMm,
  clutch: animals.clutch,
  priceMinor: saleListings.priceMinor,
  currency: saleListings.currency,
  description: saleListings.description,
  listedPublicly: saleListings.listedPublicly,
  reserved: inLiveSale,
  fromOwnSac,
  molts: moltCount,
};
export type ListingRecord = Awaited<ReturnType<typeof listedAnimals>>[number];

/** The collection's listings of animals still in it (active), by species, stage and name. */
export function listedAnimals(db: Db, collectionId: string, animalIds?: string[]) {
  return db
    .select(listingFields)
    .from(saleListings)
    .innerJoin(animals, eq(animals.id, saleListings.animalId))
    .where(
      and(
        eq(saleListings.collectionId, collectionId),
        eq(animals.status, 'active'),
        animalIds ? inArray(animals.id, animalIds) : undefined,
      ),
    )
    .orderBy(asc(animals.scientificName), asc(animals.lifeStage), asc(animals.name));
}

/** One animal's status and whether it is in a live sale; null when not in the collection. */
export async function animalsForListing(db: Db, collectionId: string, ids: string[]) {
  if (!ids.length) return [];
  return db
    .select({ id: animals.id, name: animals.name, status: animals.status, reserved: inLiveSale })
    .from(animals)
    .where(and(eq(animals.collectionId, collectionId), inArray(animals.id, ids)));
}

/** A clutch's animals in the collection, with what decides whether they can be offered. */
export function clutchAnimals(db: Db, collectionId: string, clutch: string) {
  return db
    .select({ id: animals.id, status: animals.status, reserved: inLiveSale })
    .from(animals)
    .where(and(eq(animals.collectionId, collectionId), eq(animals.clutch, clutch)));
}

/** Clutches with animals that could still be offered (active, in no live sale). */
export function offerableClutches(db: Db, collectionId: string) {
  return db
    .select({ clutch: sql<string>`${animals.clutch}`, animals: sql<number>`count(*)::int` })
    .from(animals)
    .where(
      and(
        eq(animals.collectionId, collectionId),
        eq(animals.status, 'active'),
        isNotNull(animals.clutch),
        sql`not ${inLiveSale}`,
      ),
    )
    .groupBy(animals.clutch)
    .orderBy(asc(animals.clutch));
}

export interface ListingValues {
  priceMinor: number;
  currency: string;
  description: string;
  listedPublicly: boolean;
}

/** Lists the animals, or changes their listing (price, words, public or not). */
export async function upsertListings(
  db: Db,
  collectionId: string,
  animalIds: string[],
  values: ListingValues,
  listedBy: string,
  at: Date,
) {
  if (!animalIds.length) return;
  await db
    .insert(saleListings)
    .values(
      animalIds.map((animalId) => ({
        animalId,
        collectionId,
        ...values,
        listedBy,
        listedAt: at,
        updatedAt: at,
      })),
    )
    .onConflictDoUpdate({
      target: saleListings.animalId,
      set: {
        priceMinor: sql`excluded.price_minor`,
        currency: sql`excluded.currency`,
        description: sql`excluded.description`,
        listedPublicly: sql`excluded.listed_publicly`,
        updatedAt: at,
      },
    });
}

export async function deleteListing(db: Db, collectionId: string, animalId: string) {
  const rows = await db
    .delete(saleListings)
    .where(and(eq(saleListings.collectionId, collectionId), eq(saleListings.animalId, animalId)))
    .returning({ animalId: saleListings.animalId });
  return rows.length > 0;
}

/** A listing's words, whatever became of the animal since (a sold animal's sheet keeps them). */
export async function listingDescription(db: Db, collectionId: string, animalId: string) {
  const [row] = await db
    .select({ description: saleListings.description })
    .from(saleListings)
    .where(and(eq(saleListings.collectionId, collectionId), eq(saleListings.animalId, animalId)));
  return row?.description ?? null;
}
