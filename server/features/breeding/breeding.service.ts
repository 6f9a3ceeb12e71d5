import {
  breedingDatesProblem,
  breedingFacts,
  breedingModeOf,
  breedingRefusal,
  BREEDING_FACT_KINDS,
  RECORD_SHORT,
  type BreedingDates,
} from '#shared/domain/breeding';
import { collectionPrefix, LABEL_ALPHABET } from '#shared/domain/label-codes';
import { addDays, instantOfKeeperDate, localDateOf } from '#shared/domain/local-dates';
import { runPositions } from '#shared/domain/places';
import type { EggSacBody, EggSacChange, EggSacView } from '#shared/schemas/breeding';
import type { MemberCollection } from '../../access/memberships';
import type { Db } from '../../db/client';
import { HttpError } from '../../middleware/errors';
import { recordEvents } from '../events/record-events';
import { findOrCreatePlaces } from '../locations/find-or-create-places';
import {
  codesInCollection,
  findAnimal,
  findSac,
  incubationDefaults,
  insertAnimalsReturningIds,
  insertSac,
  liveBreedingFacts,
  listSacs,
  positionsOnShelf,
  sacCountOf,
  setIncubation,
  setSlingCount,
  updateSac,
  type EggSacRow,
} from './breeding.repository';

const notFound = () => new HttpError(404, 'not_found', 'We could not find that egg sac.');

/** `count` codes in sequence ("NL-7K3", "NL-7K4"…) that no animal of the collection has yet. */
export function sequentialCodes(
  prefix: string,
  count: number,
  taken: ReadonlySet<string>,
  startAt: number,
): string[] {
  const base = LABEL_ALPHABET.length;
  const width = Math.max(3, Math.ceil(Math.log(startAt + count * 2 + 1) / Math.log(base)));
  const code = (n: number) => {
    let body = '';
    for (let i = 0; i < width; i++, n = Math.floor(n / base))
      body = LABEL_ALPHABET[n % base] + body;
    return `${prefix}-${body}`;
  };
  // The first run of `count` free codes from `startAt` on.
  for (let start = startAt; start + count <= base ** width; start++) {
    const run = Array.from({ length: count }, (_, i) => code(start + i));
    const clash = run.findIndex((c) => taken.has(c));
    if (clash === -1) return run;
    start += clash;
  }
  throw new HttpError(
    409,
    'codes_exhausted',
    'No run of free label codes is long enough; create fewer slings at once.',
  );
}

/**
 * `afterFacts`: today's round is brought in line once a record's facts are written (a sac laid
 * today withdraws the female's open feed task at once, R18).
 */
export function createBreedingService(
  db: Db,
  now: () => Date,
  afterFacts: (collectionId: string, animalIds: string[]) => Promise<void> = async () => {},
) {
  function view(
    row: EggSacRow,
    female: { name: string; group: EggSacView['femaleGroup'] },
    slingsCreated: number,
  ): EggSacView {
    return {
      id: row.id,
      kind: row.kind,
      femaleId: row.femaleId,
      femaleName: female.name,
      femaleGroup: female.group,
      clutch: row.clutch,
      laidOn: row.laidOn,
      pulledOn: row.pulledOn,
      hatchedOn: row.hatchedOn,
      dispersedOn: row.dispersedOn,
      eggCount: row.eggCount,
      eggsWithLegs: row.eggsWithLegs,
      slingCount: row.slingCount,
      incubationMinDays: row.incubationMinDays,
      incubationMaxDays: row.incubationMaxDays,
      expectedFrom: addDays(row.laidOn, row.incubationMinDays),
      expectedTo: addDays(row.laidOn, row.incubationMaxDays),
      notes: row.notes,
      slingsCreated,
    };
  }

  async function sacOf(collectionId: string, sacId: string) {
    const row = await findSac(db, collectionId, sacId);
    if (!row) throw notFound();
    return row;
  }

  function checkDates(record: BreedingDates, group: EggSacView['femaleGroup'], zone: string) {
    const problem = breedingDatesProblem(
      record,
      localDateOf(now(), zone),
      breedingModeOf(group).words,
    );
    if (problem) throw new HttpError(422, 'invalid', problem);
  }

  /**
   * Brings the female's history in line with the record's dates: each fact the dates stand for
   * is on her history once, effective on the keeper's date (noon there, or now when it is
   * today); a fact whose date changed or went is voided and written again — events are never
   * edited. The projection follows in the same transaction (a void or a past date re-folds).
   */
  async function syncFacts(tx: Db, record: EggSacRow, zone: string, userId: string) {
    const wanted = breedingFacts(record);
    const facts = await liveBreedingFacts(tx, record.femaleId, BREEDING_FACT_KINDS);
    // Facts written before records were named in them belong to this record when she has no other.
    const adopt =
      facts.some((f) => f.sacId === null) && (await sacCountOf(tx, record.femaleId)) === 1;
    const mine = facts.filter((f) => f.sacId === record.id || (adopt && f.sacId === null));
    const kept = new Set<string>();
    const missing = wanted.filter((w) => {
      const match = mine.find(
        (f) => !kept.has(f.id) && f.kind === w.kind && localDateOf(f.effectiveAt, zone) === w.date,
      );
      if (match) kept.add(match.id);
      return !match;
    });
    const stale = mine.filter((f) => !kept.has(f.id));
    const at = now();
    const base = {
      collectionId: record.collectionId,
      animalId: record.femaleId,
      recordedBy: userId,
    };
    await recordEvents(
      tx,
      { collectionId: record.collectionId, timeZone: zone },
      [
        ...stale.map((f) => ({
          ...base,
          kind: 'void' as const,
          payload: { targetId: f.id, note: 'The record’s date changed.' },
        })),
        ...missing.map((w) => ({
          ...base,
          kind: w.kind,
          payload: { sacId: record.id },
          effectiveAt: instantOfKeeperDate(w.date, zone, at),
        })),
      ],
      { from: 'server', at },
    );
  }

  return {
    async list(collectionId: string): Promise<EggSacView[]> {
      return (await listSacs(db, collectionId)).map((r) =>
        view(r.sac, { name: r.female, group: r.group }, r.slingsCreated),
      );
    },

    async setIncubation(collectionId: string, minDays: number, maxDays: number) {
      await setIncubation(db, collectionId, minDays, maxDays);
    },

    /**
     * A sac, egg case or brood — whichever the female's group has — laid (or born) on the
     * keeper's date. Only females of groups that have one: a male, an animal whose sex is not
     * known, a beetle are refused with the reason. A sac or brood leaves her alone (R11).
     */
    async create(c: MemberCollection, userId: string, body: EggSacBody) {
      const { collectionId } = c;
      const female = await findAnimal(db, collectionId, body.femaleId);
      if (!female) throw new HttpError(404, 'not_found', 'We could not find that animal.');
      const refusal = breedingRefusal(female);
      if (refusal) throw new HttpError(422, 'invalid', refusal);
      const mode = breedingModeOf(female.group);
      const kind = mode.record!;
      checkDates(
        { kind, laidOn: body.laidOn, pulledOn: null, hatchedOn: null, dispersedOn: null },
        female.group,
        c.timeZone,
      );
      const window = body.incubation ?? mode.window ?? (await incubationDefaults(db, collectionId));
      const row = await db.transaction(async (tx) => {
        const inserted = await insertSac(tx, {
          collectionId,
          femaleId: female.id,
          kind,
          clutch: body.clutch || `${female.name} ${RECORD_SHORT[kind]} ${body.laidOn}`,
          laidOn: body.laidOn,
          eggCount: body.eggCount ?? null,
          slingCount: body.slingCount ?? null,
          incubationMinDays: window.minDays,
          incubationMaxDays: window.maxDays,
          notes: body.notes ?? null,
        });
        await syncFacts(tx, inserted, c.timeZone, userId);
        return inserted;
      });
      await afterFacts(collectionId, [female.id]);
      return view(row, female, 0);
    },

    /**
     * New dates or counts. Pulling a sac — or its hatching with her when it was never pulled —
     * and a brood's dispersal end her guarding and start her rebuild (R8), from those dates.
     */
    async change(c: MemberCollection, userId: string, sacId: string, body: EggSacChange) {
      const { collectionId } = c;
      const sac = await sacOf(collectionId, sacId);
      const female = (await findAnimal(db, collectionId, sac.femaleId))!;
      const { incubation, ...rest } = body;
      checkDates({ ...sac, ...rest }, female.group, c.timeZone);
      await db.transaction(async (tx) => {
        const values = {
          ...rest,
          ...(incubation
            ? { incubationMinDays: incubation.minDays, incubationMaxDays: incubation.maxDays }
            : {}),
        };
        const updated = Object.keys(values).length ? await updateSac(tx, sac.id, values) : sac;
        await syncFacts(tx, updated, c.timeZone, userId);
      });
      await afterFacts(collectionId, [female.id]);
    },

    /**
     * The clutch potted up: `count` slings in one transaction — all or none — numbered in
     * sequence, codes in sequence, one place each along the tray from `firstPosition`.
     */
    async createSlings(
      c: MemberCollection,
      sacId: string,
      body: {
        count: number;
        namePrefix: string;
        room: string;
        rack: string;
        shelf: string;
        firstPosition: number;
      },
    ): Promise<string[]> {
      const { collectionId } = c;
      const sac = await sacOf(collectionId, sacId);
      return db.transaction(async (tx) => {
        const female = (await findAnimal(tx, collectionId, sac.femaleId))!;
        const taken = new Set(await codesInCollection(tx, collectionId));
        const prefix = collectionPrefix(c.collectionName, [...taken]);
        const codes = sequentialCodes(prefix, body.count, taken, Math.floor(Math.random() * 1000));
        const shelf = { room: body.room, rack: body.rack, shelf: body.shelf };
        // Pots take the shelf's own spots where they exist ("01" for 1), else new ones.
        const positions = runPositions(
          await positionsOnShelf(tx, collectionId, shelf),
          body.firstPosition,
          body.count,
        );
        const places = await findOrCreatePlaces(
          tx,
          collectionId,
          positions.map((position) => ({ ...shelf, position })),
        );
        const width = String(body.firstPosition + body.count - 1).length;
        const rows = positions.map((position, i) => ({
          collectionId,
          labelCode: codes[i]!,
          name: `${body.namePrefix} ${String(i + 1).padStart(Math.max(2, width), '0')}`,
          scientificName: female.scientificName,
          commonName: female.commonName,
          group: female.group,
          lifeStage: 'sling' as const,
          sex: 'unknown' as const,
          locationId: places.idOf({ ...shelf, position }),
          cautions: female.cautions,
          clutch: sac.clutch,
          acquiredOn: sac.dispersedOn ?? sac.hatchedOn ?? sac.pulledOn ?? sac.laidOn,
          source: `Own breeding: ${female.name}, ${RECORD_SHORT[sac.kind]} ${breedingModeOf(female.group).words.startedOn.toLowerCase()} ${sac.laidOn}`,
        }));
        const ids = await insertAnimalsReturningIds(tx, rows);
        if (sac.slingCount === null) await setSlingCount(tx, sac.id, body.count);
        return ids;
      });
    },
  };
}
export type BreedingService = ReturnType<typeof createBreedingService>;
