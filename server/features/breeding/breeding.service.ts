import { and, asc, count, eq, inArray } from 'drizzle-orm';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import { collectionPrefix, LABEL_ALPHABET } from '../../../shared/domain/label-codes';
import { addDays, type LocalDate } from '../../../shared/domain/local-dates';
import type { EggSacView } from '../../../shared/schemas/breeding';
import { animals, eggSacs } from '../../db/schema/animals';
import { collections, locations } from '../../db/schema/collections';
import { HttpError } from '../../middleware/errors';
import { recordServerEvents } from '../animals/animal-events';

const notFound = () => new HttpError(404, 'not_found', 'We could not find that egg sac.');

/** `count` codes in sequence ("NL-7K3", "NL-7K4"…) that no animal of the collection has yet. */
export function sequentialCodes(prefix: string, count: number, taken: ReadonlySet<string>, startAt: number): string[] {
  const base = LABEL_ALPHABET.length;
  const width = Math.max(3, Math.ceil(Math.log(startAt + count * 2 + 1) / Math.log(base)));
  const code = (n: number) => {
    let body = '';
    for (let i = 0; i < width; i++, n = Math.floor(n / base)) body = LABEL_ALPHABET[n % base] + body;
    return `${prefix}-${body}`;
  };
  // The first run of `count` free codes from `startAt` on.
  for (let start = startAt; start + count <= base ** width; start++) {
    const run = Array.from({ length: count }, (_, i) => code(start + i));
    const clash = run.findIndex((c) => taken.has(c));
    if (clash === -1) return run;
    start += clash;
  }
  throw new HttpError(409, 'codes_exhausted', 'No run of free label codes is long enough; create fewer slings at once.');
}

export function createBreedingService(db: NodePgDatabase, now: () => Date) {
  async function collectionOf(collectionId: string) {
    const [c] = await db.select().from(collections).where(eq(collections.id, collectionId));
    return c!;
  }

  function view(row: typeof eggSacs.$inferSelect, femaleName: string, slingsCreated: number): EggSacView {
    return {
      id: row.id,
      femaleId: row.femaleId,
      femaleName,
      clutch: row.clutch,
      laidOn: row.laidOn,
      pulledOn: row.pulledOn,
      hatchedOn: row.hatchedOn,
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
    const [row] = await db.select().from(eggSacs).where(and(eq(eggSacs.id, sacId), eq(eggSacs.collectionId, collectionId)));
    if (!row) throw notFound();
    return row;
  }

  return {
    async list(collectionId: string): Promise<EggSacView[]> {
      const rows = await db
        .select({ sac: eggSacs, female: animals.name })
        .from(eggSacs)
        .innerJoin(animals, eq(animals.id, eggSacs.femaleId))
        .where(eq(eggSacs.collectionId, collectionId))
        .orderBy(asc(eggSacs.laidOn));
      const clutches = rows.map((r) => r.sac.clutch);
      const made = clutches.length
        ? await db.select({ clutch: animals.clutch, n: count() }).from(animals).where(and(eq(animals.collectionId, collectionId), inArray(animals.clutch, clutches))).groupBy(animals.clutch)
        : [];
      const byClutch = new Map(made.map((m) => [m.clutch, m.n]));
      return rows.map((r) => view(r.sac, r.female, byClutch.get(r.sac.clutch) ?? 0));
    },

    async setIncubation(collectionId: string, minDays: number, maxDays: number) {
      await db.update(collections).set({ incubationMinDays: minDays, incubationMaxDays: maxDays }).where(eq(collections.id, collectionId));
    },

    /** A sac laid: the female guards it (left alone on the round) until it is pulled. */
    async create(collectionId: string, userId: string, body: { femaleId: string; laidOn: LocalDate; clutch?: string; incubation?: { minDays: number; maxDays: number }; notes?: string | null }) {
      const c = await collectionOf(collectionId);
      const [female] = await db.select().from(animals).where(and(eq(animals.id, body.femaleId), eq(animals.collectionId, collectionId)));
      if (!female) throw new HttpError(404, 'not_found', 'We could not find that animal.');
      if (female.sex === 'male' || female.sex === 'mature_male') throw new HttpError(422, 'invalid', `${female.name} is recorded as a male. Change the sex on the animal's page if that is wrong.`);
      const [row] = await db.transaction(async (tx) => {
        const inserted = await tx
          .insert(eggSacs)
          .values({
            collectionId,
            femaleId: female.id,
            clutch: body.clutch || `${female.name} sac ${body.laidOn}`,
            laidOn: body.laidOn,
            incubationMinDays: body.incubation?.minDays ?? c.incubationMinDays,
            incubationMaxDays: body.incubation?.maxDays ?? c.incubationMaxDays,
            notes: body.notes ?? null,
          })
          .returning();
        await recordServerEvents(tx, [{ collectionId, animalId: female.id, kind: 'sac_laid', payload: {}, recordedBy: userId }], now());
        return inserted;
      });
      return view(row!, female.name, 0);
    },

    /** Pulling the sac starts the female's rebuild (rule R8) through a "sac pulled" fact. */
    async change(collectionId: string, userId: string, sacId: string, body: { pulledOn?: string | null; hatchedOn?: string | null; eggCount?: number | null; eggsWithLegs?: number | null; slingCount?: number | null; incubation?: { minDays: number; maxDays: number }; notes?: string | null }) {
      const sac = await sacOf(collectionId, sacId);
      const { incubation, ...rest } = body;
      await db.transaction(async (tx) => {
        await tx
          .update(eggSacs)
          .set({ ...rest, ...(incubation ? { incubationMinDays: incubation.minDays, incubationMaxDays: incubation.maxDays } : {}) })
          .where(eq(eggSacs.id, sac.id));
        if (body.pulledOn && !sac.pulledOn) {
          await recordServerEvents(tx, [{ collectionId, animalId: sac.femaleId, kind: 'sac_pulled', payload: body.eggCount ? { eggCount: body.eggCount } : {}, recordedBy: userId }], now());
        }
      });
    },

    /**
     * The clutch potted up: `count` slings in one transaction — all or none — numbered in
     * sequence, codes in sequence, one place each along the tray from `firstPosition`.
     */
    async createSlings(collectionId: string, sacId: string, body: { count: number; namePrefix: string; room: string; rack: string; shelf: string; firstPosition: number }): Promise<string[]> {
      const sac = await sacOf(collectionId, sacId);
      const c = await collectionOf(collectionId);
      return db.transaction(async (tx) => {
        const [female] = await tx.select().from(animals).where(eq(animals.id, sac.femaleId));
        const taken = new Set((await tx.select({ code: animals.labelCode }).from(animals).where(eq(animals.collectionId, collectionId))).map((r) => r.code));
        const prefix = collectionPrefix(c.name, [...taken]);
        const codes = sequentialCodes(prefix, body.count, taken, Math.floor(Math.random() * 1000));
        const positions = Array.from({ length: body.count }, (_, i) => String(body.firstPosition + i));
        const existing = await tx
          .select({ id: locations.id, position: locations.position })
          .from(locations)
          .where(and(eq(locations.collectionId, collectionId), eq(locations.room, body.room), eq(locations.rack, body.rack), eq(locations.shelf, body.shelf), inArray(locations.position, positions)));
        const place = new Map(existing.map((l) => [l.position, l.id]));
        const missing = positions.filter((p) => !place.has(p));
        if (missing.length) {
          const [{ last } = { last: 0 }] = await tx.select({ last: locations.walkOrder }).from(locations).where(eq(locations.collectionId, collectionId)).orderBy(asc(locations.walkOrder)).then((r) => [{ last: r.at(-1)?.last ?? 0 }]);
          const made = await tx
            .insert(locations)
            .values(missing.map((position, i) => ({ collectionId, room: body.room, rack: body.rack, shelf: body.shelf, position, walkOrder: last + i + 1 })))
            .returning({ id: locations.id, position: locations.position });
          for (const l of made) place.set(l.position, l.id);
        }
        const width = String(body.firstPosition + body.count - 1).length;
        const rows = positions.map((position, i) => ({
          collectionId,
          labelCode: codes[i]!,
          name: `${body.namePrefix} ${String(i + 1).padStart(Math.max(2, width), '0')}`,
          scientificName: female!.scientificName,
          commonName: female!.commonName,
          group: female!.group,
          lifeStage: 'sling' as const,
          sex: 'unknown' as const,
          locationId: place.get(position)!,
          cautions: female!.cautions,
          clutch: sac.clutch,
          acquiredOn: sac.hatchedOn ?? sac.pulledOn ?? sac.laidOn,
          source: `Own breeding: ${female!.name}, sac laid ${sac.laidOn}`,
        }));
        const ids: string[] = [];
        for (let i = 0; i < rows.length; i += 250) ids.push(...(await tx.insert(animals).values(rows.slice(i, i + 250)).returning({ id: animals.id })).map((r) => r.id));
        if (sac.slingCount === null) await tx.update(eggSacs).set({ slingCount: body.count }).where(eq(eggSacs.id, sac.id));
        return ids;
      });
    },
  };
}
export type BreedingService = ReturnType<typeof createBreedingService>;
