import { and, eq, inArray } from 'drizzle-orm';
import { mergeMoltDetails, sexFromMolts, type MoltFact } from '../../../shared/domain/growth';
import { localDateOf } from '../../../shared/domain/local-dates';
import type { Db } from '../../db/client';
import { animals, events } from '../../db/schema/animals';

/**
 * After new molts arrive, each animal's record follows them: the size after its latest sized
 * molt, and the sex the exuviae or a maturing molt shows (a molt undone by a void does not count).
 */
export async function applyMoltFacts(db: Db, collectionId: string, zone: string, animalIds: string[]) {
  if (!animalIds.length) return;
  const rows = await db
    .select({ id: events.id, animalId: events.animalId, kind: events.kind, payload: events.payload, at: events.effectiveAt })
    .from(events)
    .where(and(eq(events.collectionId, collectionId), inArray(events.animalId, animalIds), inArray(events.kind, ['molted', 'molt_details', 'void'])));
  const voided = new Set(rows.filter((r) => r.kind === 'void').map((r) => (r.payload as { targetId?: string }).targetId));
  const current = await db.select({ id: animals.id, sex: animals.sex }).from(animals).where(inArray(animals.id, animalIds));
  for (const a of current) {
    const live = rows.filter((r) => r.animalId === a.id && r.kind !== 'void' && !voided.has(r.id)).map((r) => ({ ...r, payload: r.payload as Record<string, unknown>, at: r.at.toISOString() }));
    const molts: MoltFact[] = mergeMoltDetails(live)
      .filter((r) => r.kind === 'molted')
      .map((r) => ({ date: localDateOf(new Date(r.at), zone), ...(r.payload as Omit<MoltFact, 'date'>) }))
      .sort((x, y) => x.date.localeCompare(y.date));
    const sized = molts.filter((m) => typeof m.sizeMm === 'number').at(-1);
    await db
      .update(animals)
      .set({ sex: sexFromMolts(a.sex, molts), ...(sized ? { sizeMm: sized.sizeMm! } : {}) })
      .where(eq(animals.id, a.id));
  }
}
