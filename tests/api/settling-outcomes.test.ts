// Bringing today's round in line at each sync reads, per animal, only the first standing outcome
// of each kind (loadSettlingOutcomes): it must settle exactly the tasks the day's whole list of
// outcomes settles, undos of undos and other days and animals included.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { TaskKind } from '#shared/domain/rounds/build-round';
import { liveOutcomes, SETTLED_BY, settlingOutcome } from '#shared/domain/rounds/settle';
import { insertEvents } from '../../server/features/events/events.repository';
import { outcomesOf } from '../../server/features/rounds/round-input';
import { loadOutcomes, loadSettlingOutcomes } from '../../server/features/rounds/rounds.repository';
import { createAnimal, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let owner: SignedUp;
const from = new Date('2026-11-10T05:00:00Z');
const to = new Date('2026-11-11T05:00:00Z');
const at = (minutes: number) => new Date(from.getTime() + minutes * 60_000);

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx);
});
afterAll(async () => {
  await ctx.close();
});

async function record(animalId: string, kind: string, when: Date, payload = {}) {
  const id = randomUUID();
  await insertEvents(
    ctx.database.db,
    [
      {
        id,
        collectionId: owner.collectionId,
        animalId,
        kind,
        payload,
        recordedBy: owner.userId,
        deviceId: 'test',
        clientRecordedAt: when,
        clientSentAt: when,
        serverReceivedAt: when,
        effectiveAt: when,
      },
    ],
    'fail',
  );
  return id;
}

describe('the outcomes a reconciliation reads', () => {
  it('settle exactly the tasks the whole day’s outcomes settle', async () => {
    const db = ctx.database.db;
    const a = (await createAnimal(db, owner.collectionId)).id;
    const b = (await createAnimal(db, owner.collectionId)).id;
    const c = (await createAnimal(db, owner.collectionId)).id;
    const d = (await createAnimal(db, owner.collectionId)).id;
    // a: a meal undone, then a refusal; watered twice, the first undone.
    const meal = await record(a, 'ate', at(10));
    await record(a, 'void', at(11), { targetId: meal });
    await record(a, 'refused', at(20));
    const water = await record(a, 'watered', at(30));
    await record(a, 'void', at(31), { targetId: water });
    await record(a, 'watered', at(40));
    // b: prey left in, its undo undone (an undone event stays undone); misted yesterday only.
    const left = await record(b, 'prey_left_in', at(5));
    const undo = await record(b, 'void', at(6), { targetId: left });
    await record(b, 'void', at(7), { targetId: undo });
    await record(b, 'misted', at(-60));
    await record(b, 'spot_cleaned', at(24 * 60 + 1));
    // c: an undo from another day does not count on this one; skipped and rehoused stand.
    const note = await record(c, 'note', at(50), { text: 'Webbing' });
    await record(c, 'void', at(24 * 60 + 30), { targetId: note });
    await record(c, 'skipped', at(55));
    await record(c, 'rehoused', at(56));
    // d: nothing today but an undo naming a's second watering: it counts on d's list, not a's.
    await record(d, 'ate', at(-120));
    const water2 = await record(a, 'watered', at(45));
    await record(d, 'void', at(46), { targetId: water2 });

    const ids = [a, b, c, d];
    const all = outcomesOf(await loadOutcomes(db, owner.collectionId, from, to, ids));
    const few = outcomesOf(await loadSettlingOutcomes(db, owner.collectionId, from, to, ids));
    const settled = (outcomes: typeof all, id: string) =>
      Object.fromEntries(
        (Object.keys(SETTLED_BY) as TaskKind[]).map((k) => [
          k,
          settlingOutcome(k, liveOutcomes(outcomes.get(id) ?? []))?.eventId ?? null,
        ]),
      );
    for (const id of ids) expect(settled(few, id)).toEqual(settled(all, id));
    // The cases above are not trivial: some tasks are settled, some not.
    expect(settled(few, a)).toMatchObject({ feed: expect.any(String), water: expect.any(String) });
    expect(few.get(a)!.some((o) => o.kind === 'watered')).toBe(true);
    expect(settled(few, b)).toMatchObject({ feed: null, mist: null, spot_clean: null });
    expect(settled(few, c).check).toEqual(note);
    expect(settled(few, d).feed).toBeNull();
    expect(few.get(a)!.length).toBeLessThan(all.get(a)!.length);
  });
});
