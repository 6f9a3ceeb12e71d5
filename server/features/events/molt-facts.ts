import { mergeMoltDetails, sexFromMolts, type MoltFact } from '#shared/domain/growth';
import { localDateOf } from '#shared/domain/local-dates';
import type { Db } from '../../db/client';
import { moltRecordsOf, setSexAndSize, sexesOf } from './events.repository';

/** Kinds after which an animal's size and sex are worked out again from its molts. */
export const MOLT_FACT_KINDS: readonly string[] = ['molted', 'molt_details', 'void'];

/**
 * After new molts arrive, each animal's record follows them: the size after its latest sized
 * molt, and the sex the exuviae or a maturing molt shows (a molt undone by a void does not count).
 */
export async function applyMoltFacts(
  db: Db,
  collectionId: string,
  zone: string,
  animalIds: string[],
) {
  if (!animalIds.length) return;
  const rows = await moltRecordsOf(db, collectionId, animalIds);
  const voided = new Set(
    rows.filter((r) => r.kind === 'void').map((r) => (r.payload as { targetId?: string }).targetId),
  );
  for (const a of await sexesOf(db, animalIds)) {
    const live = rows
      .filter((r) => r.animalId === a.id && r.kind !== 'void' && !voided.has(r.id))
      .map((r) => ({
        ...r,
        payload: r.payload as Record<string, unknown>,
        at: r.at.toISOString(),
      }));
    const molts: MoltFact[] = mergeMoltDetails(live)
      .filter((r) => r.kind === 'molted')
      .map((r) => ({
        date: localDateOf(new Date(r.at), zone),
        ...(r.payload as Omit<MoltFact, 'date'>),
      }))
      .sort((x, y) => x.date.localeCompare(y.date));
    const sized = molts.filter((m) => typeof m.sizeMm === 'number').at(-1);
    await setSexAndSize(db, a.id, {
      sex: sexFromMolts(a.sex, molts),
      ...(sized ? { sizeMm: sized.sizeMm! } : {}),
    });
  }
}
