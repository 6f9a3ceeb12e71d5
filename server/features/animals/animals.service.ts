import { randomInt } from 'node:crypto';
import { collectionPrefix, generateLabelCodes } from '#shared/domain/label-codes';
import { compareLocations } from '#shared/domain/walk-order';
import type { AnimalSummary, AnimalValues, MoveBody, RetireBody } from '#shared/schemas/animals';
import type { CareSettingsBody } from '#shared/schemas/rules';
import type { MemberCollection } from '../../access/memberships';
import type { Db } from '../../db/client';
import { isUniqueViolation } from '../../db/errors';
import { HttpError } from '../../middleware/errors';
import { recordEvents, type EventCollection } from '../events/record-events';
import { toAnimalSummary } from './animal-summary';
import {
  codesInCollection,
  findPlaceAndStatus,
  insertAnimal,
  insertAnimals,
  listAnimals,
  locationInCollection,
  moveAnimals,
  placesOfAnimals,
  updateAnimal,
  updateAnimalCare,
} from './animals.repository';

const randomUnit = () => randomInt(2 ** 32) / 2 ** 32;
const notFound = () => new HttpError(404, 'not_found', 'We could not find that animal.');
const codeTaken = (code: string) =>
  new HttpError(
    409,
    'code_taken',
    `Another animal already has the code ${code}. Leave the code empty to get a new one.`,
  );

/** The stored columns for what a keeper entered. */
function columnsOf(v: AnimalValues) {
  return {
    name: v.name,
    scientificName: v.scientificName,
    commonName: v.commonName,
    group: v.group,
    lifeStage: v.lifeStage,
    sex: v.sex,
    sizeMm: v.sizeMm,
    acquiredOn: v.acquiredOn,
    source: v.source,
    locationId: v.locationId,
    cautions: v.cautions,
    cautionNote: v.cautionNote,
    notes: v.notes,
    clutch: v.clutch,
    ...v.care,
  };
}

/**
 * Called in the transaction before an animal's status changes, except when a sale ships it
 * (the sales feature, wired in app.ts): it may refuse with an HttpError or tidy its own rows.
 */
export type StatusChangeGuard = (
  tx: Db,
  collectionId: string,
  animalId: string,
  change: { from: string; to: string },
) => Promise<void>;

export function createAnimalsService(
  db: Db,
  now: () => Date = () => new Date(),
  statusChangeGuard: StatusChangeGuard = async () => {},
) {
  async function checkLocation(tx: Db, collectionId: string, locationId: string | null) {
    if (locationId && !(await locationInCollection(tx, collectionId, locationId))) {
      throw new HttpError(
        422,
        'invalid',
        'That place is not in this collection. Choose one from the list.',
        [{ path: 'locationId', message: 'Choose a place from the list.' }],
      );
    }
  }

  async function summaryOf(collectionId: string, animalId: string): Promise<AnimalSummary> {
    const [row] = await listAnimals(db, collectionId, [animalId]);
    if (!row) throw notFound();
    return toAnimalSummary(row.animal, row.location);
  }

  /** Codes for new animals: the collection's usual prefix, never one already used. */
  async function newCodes(tx: Db, c: MemberCollection, count: number): Promise<string[]> {
    const taken = await codesInCollection(tx, c.collectionId);
    return generateLabelCodes(
      collectionPrefix(c.collectionName, taken),
      count,
      randomUnit,
      new Set(taken),
    );
  }

  return {
    async list(collectionId: string): Promise<AnimalSummary[]> {
      const rows = await listAnimals(db, collectionId);
      const summaries = rows.map(({ animal, location }) => toAnimalSummary(animal, location));
      return summaries.sort(
        (x, y) =>
          compareLocations(x.location, y.location) || x.labelCode.localeCompare(y.labelCode),
      );
    },

    get: summaryOf,

    async create(c: MemberCollection, values: AnimalValues): Promise<AnimalSummary> {
      const { collectionId } = c;
      const id = await db.transaction(async (tx) => {
        await checkLocation(tx, collectionId, values.locationId);
        const labelCode = values.labelCode || (await newCodes(tx, c, 1))[0]!;
        try {
          return await insertAnimal(tx, { collectionId, labelCode, ...columnsOf(values) });
        } catch (err) {
          if (isUniqueViolation(err)) throw codeTaken(labelCode);
          throw err;
        }
      });
      return summaryOf(collectionId, id);
    },

    /** Many animals at once (a CSV import): all or nothing, codes drawn for rows without one. */
    async createMany(c: MemberCollection, rows: AnimalValues[], outer?: Db): Promise<number> {
      const { collectionId } = c;
      return (outer ?? db).transaction(async (tx) => {
        const locationIds = [
          ...new Set(rows.map((r) => r.locationId).filter((l): l is string => !!l)),
        ];
        for (const l of locationIds) await checkLocation(tx, collectionId, l);
        const fresh = await newCodes(tx, c, rows.filter((r) => !r.labelCode).length);
        const values = rows.map((r) => ({
          collectionId,
          labelCode: r.labelCode || fresh.pop()!,
          ...columnsOf(r),
        }));
        try {
          await insertAnimals(tx, values);
        } catch (err) {
          if (isUniqueViolation(err)) {
            throw new HttpError(
              409,
              'code_taken',
              'Some label codes in the file are already used in this collection. Clear those codes to have new ones drawn.',
            );
          }
          throw err;
        }
        return values.length;
      });
    },

    /** An edit; a change of place is kept in the history as a move. The code changes only by re-labelling. */
    async update(
      collection: EventCollection,
      animalId: string,
      userId: string,
      values: AnimalValues,
    ): Promise<AnimalSummary> {
      const { collectionId } = collection;
      await db.transaction(async (tx) => {
        const before = await findPlaceAndStatus(tx, collectionId, animalId);
        if (!before) throw notFound();
        await checkLocation(tx, collectionId, values.locationId);
        await updateAnimal(tx, animalId, { ...columnsOf(values), updatedAt: now() });
        if (before.locationId !== values.locationId && values.locationId) {
          await recordEvents(
            tx,
            collection,
            [
              {
                animalId,
                kind: 'moved',
                payload: { fromLocationId: before.locationId, toLocationId: values.locationId },
                recordedBy: userId,
              },
            ],
            { from: 'server', at: now() },
          );
        }
      });
      return summaryOf(collectionId, animalId);
    },

    /** Sold, deceased, rehomed or on loan: off the round from now on, history kept. */
    async setStatus(
      collection: EventCollection,
      animalId: string,
      userId: string,
      body: { status: AnimalSummary['status']; date: string | null; note?: string | null },
    ) {
      await db.transaction((tx) => this.setStatusIn(tx, collection, animalId, userId, body));
      return summaryOf(collection.collectionId, animalId);
    },

    /**
     * The status change inside a caller's transaction: a sale retires its animals as sold in
     * the same transaction that marks it shipped (`saleId` links the sale in the history).
     */
    async setStatusIn(
      tx: Db,
      collection: EventCollection,
      animalId: string,
      userId: string,
      body: {
        status: AnimalSummary['status'];
        date: string | null;
        note?: string | null;
        saleId?: string;
      },
    ): Promise<void> {
      const before = await findPlaceAndStatus(tx, collection.collectionId, animalId);
      if (!before) throw notFound();
      if (before.status === body.status)
        throw new HttpError(
          409,
          'unchanged',
          `The animal is already ${body.status.replace('_', ' ')}.`,
        );
      if (!body.saleId)
        await statusChangeGuard(tx, collection.collectionId, animalId, {
          from: before.status,
          to: body.status,
        });
      await updateAnimal(tx, animalId, {
        status: body.status,
        statusDate: body.date,
        updatedAt: now(),
      });
      await recordEvents(
        tx,
        collection,
        [
          {
            animalId,
            kind: 'status_changed',
            payload: {
              from: before.status,
              to: body.status,
              ...(body.note ? { note: body.note } : {}),
              ...(body.saleId ? { saleId: body.saleId } : {}),
            },
            recordedBy: userId,
          },
        ],
        { from: 'server', at: now() },
      );
    },

    retire(collection: EventCollection, animalId: string, userId: string, body: RetireBody) {
      return this.setStatus(collection, animalId, userId, {
        status: body.status,
        date: body.date,
        note: body.note,
      });
    },

    /**
     * One animal or many to one place; each gets a "moved" fact in its history. A rehouse into
     * a new enclosure is recorded even in the same place: it starts settling (R16).
     */
    async move(
      collection: EventCollection,
      userId: string,
      { animalIds, locationId, rehoused }: MoveBody,
    ): Promise<number> {
      const { collectionId } = collection;
      const ids = [...new Set(animalIds)];
      return db.transaction(async (tx) => {
        await checkLocation(tx, collectionId, locationId);
        const rows = await placesOfAnimals(tx, collectionId, ids);
        if (rows.length !== ids.length)
          throw new HttpError(
            404,
            'not_found',
            'Some of these animals are not in this collection. Reload and choose again.',
          );
        const moving = rehoused ? rows : rows.filter((r) => r.locationId !== locationId);
        if (!moving.length) return 0;
        await moveAnimals(
          tx,
          moving.map((r) => r.id),
          locationId,
          now(),
        );
        await recordEvents(
          tx,
          collection,
          moving.map((r) => ({
            animalId: r.id,
            kind: 'moved' as const,
            payload: {
              fromLocationId: r.locationId,
              toLocationId: locationId,
              ...(rehoused ? { rehoused: true } : {}),
            },
            recordedBy: userId,
          })),
          { from: 'server', at: now() },
        );
        return moving.length;
      });
    },

    /** The care settings the round engine honours for one animal (interval, offer, dish…). */
    async updateCare(collectionId: string, animalId: string, body: CareSettingsBody) {
      if (!(await updateAnimalCare(db, collectionId, animalId, body))) throw notFound();
    },
  };
}
export type AnimalsService = ReturnType<typeof createAnimalsService>;
