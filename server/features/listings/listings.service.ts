import { groupStock, instarOf, type StockAnimal } from '#shared/domain/sales/availability';
import type { CurrencyCode } from '#shared/domain/sales/money';
import type {
  BulkListingBody,
  BulkListingResponse,
  ListingBody,
  ListingRow,
  ListingsResponse,
} from '#shared/schemas/listings';
import type { MemberCollection } from '../../access/memberships';
import type { Db } from '../../db/client';
import { HttpError } from '../../middleware/errors';
import {
  animalsForListing,
  clutchAnimals,
  deleteListing,
  listedAnimals,
  listingDescription,
  offerableClutches,
  upsertListings,
  type ListingRecord,
} from './listings.repository';

const toRow = (r: ListingRecord): ListingRow => ({
  animalId: r.animalId,
  name: r.name,
  labelCode: r.labelCode,
  scientificName: r.scientificName,
  commonName: r.commonName,
  group: r.group,
  lifeStage: r.lifeStage,
  sex: r.sex,
  sizeMm: r.sizeMm,
  instar: instarOf(r.fromOwnSac, r.molts),
  clutch: r.clutch,
  priceMinor: r.priceMinor,
  currency: r.currency as CurrencyCode,
  description: r.description,
  listedPublicly: r.listedPublicly,
  state: r.reserved ? 'reserved' : 'available',
});

const notActive = (names: string[]) =>
  new HttpError(
    409,
    'not_active',
    `${names.join(', ')} ${names.length === 1 ? 'is' : 'are'} no longer in the collection (sold, deceased, rehomed or on loan): only animals you keep can be offered.`,
  );

/**
 * Animals offered for sale (sales part L). A listing is a price and words; whether the animal
 * is available or reserved comes from the sales' own rows, never stored twice. The animal stays
 * on the round until it leaves the collection.
 */
export function createListingsService(db: Db, now: () => Date) {
  const service = {
    async list(c: MemberCollection): Promise<ListingsResponse> {
      const [records, clutches] = await Promise.all([
        listedAnimals(db, c.collectionId),
        offerableClutches(db, c.collectionId),
      ]);
      const rows = records.map(toRow);
      return { rows, groups: groupStock(rows), clutches };
    },

    /** Everything listed and still kept, as the availability list groups it. */
    async stock(collectionId: string): Promise<StockAnimal[]> {
      return (await listedAnimals(db, collectionId)).map(toRow);
    },

    /** One animal's listing, or null when it is not offered. */
    async listingOf(collectionId: string, animalId: string): Promise<ListingRow | null> {
      const [r] = await listedAnimals(db, collectionId, [animalId]);
      return r ? toRow(r) : null;
    },

    /** What the breeder wrote for the buyer, kept after the animal is sold; '' when none. */
    async descriptionOf(collectionId: string, animalId: string): Promise<string> {
      return (await listingDescription(db, collectionId, animalId)) ?? '';
    },

    async put(
      c: MemberCollection,
      userId: string,
      animalId: string,
      body: ListingBody,
    ): Promise<ListingRow> {
      const [animal] = await animalsForListing(db, c.collectionId, [animalId]);
      if (!animal) throw new HttpError(404, 'not_found', 'We could not find that animal.');
      if (animal.status !== 'active') throw notActive([animal.name]);
      await upsertListings(db, c.collectionId, [animalId], body, userId, now());
      return (await service.listingOf(c.collectionId, animalId))!;
    },

    async remove(c: MemberCollection, animalId: string): Promise<void> {
      if (!(await deleteListing(db, c.collectionId, animalId)))
        throw new HttpError(404, 'not_found', 'That animal is not offered for sale.');
    },

    /**
     * One price for many. A clutch: all its animals still kept and in no live sale (whatever
     * stage they have reached); the rest are counted as skipped. Chosen animals: all must be in
     * the collection and kept, or nothing is listed.
     */
    async bulk(
      c: MemberCollection,
      userId: string,
      body: BulkListingBody,
    ): Promise<BulkListingResponse> {
      const values = {
        priceMinor: body.priceMinor,
        currency: body.currency,
        description: body.description,
        listedPublicly: body.listedPublicly,
      };
      return db.transaction(async (tx) => {
        if (body.clutch !== undefined) {
          const all = await clutchAnimals(tx, c.collectionId, body.clutch);
          if (!all.length)
            throw new HttpError(
              404,
              'not_found',
              `No animal of this collection belongs to the clutch “${body.clutch}”.`,
            );
          const ids = all.filter((a) => a.status === 'active' && !a.reserved).map((a) => a.id);
          await upsertListings(tx, c.collectionId, ids, values, userId, now());
          return { listed: ids.length, skipped: all.length - ids.length };
        }
        const ids = [...new Set(body.animalIds!)];
        const found = await animalsForListing(tx, c.collectionId, ids);
        if (found.length !== ids.length)
          throw new HttpError(
            404,
            'not_found',
            'Some of these animals are not in this collection. Reload the list and choose again.',
          );
        const gone = found.filter((a) => a.status !== 'active');
        if (gone.length) throw notActive(gone.map((a) => a.name));
        await upsertListings(tx, c.collectionId, ids, values, userId, now());
        return { listed: ids.length, skipped: 0 };
      });
    },
  };
  return service;
}
export type ListingsService = ReturnType<typeof createListingsService>;
