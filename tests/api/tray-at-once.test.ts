// "All ate except two" on a 24-pot tray: the real client outbox (fake-indexeddb) with no network,
// then the real sync engine against the real server: exactly 22 ate + the two chosen outcomes.
import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import { and, eq, inArray } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RecordedEvent } from '#shared/schemas/events';
import type { RoundResponse } from '#shared/schemas/rounds';
import { animals, events } from '../../server/db/schema/animals';
import { openRacksideDb } from '../../src/lib/db';
import { recordTaps, waitingTaps } from '../../src/lib/outbox';
import { cachedRound, storeServerRound } from '../../src/lib/round-cache';
import { createSyncEngine } from '../../src/lib/sync';
import { signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let keeper: SignedUp;

beforeAll(async () => {
  ctx = await createTestContext();
  keeper = await signUp(ctx);
});
afterAll(async () => {
  await ctx.close();
});

describe('a tray at once', () => {
  it('writes 22 ate and the two exceptions offline in one go, and syncs them exactly once', async () => {
    const base = `/api/collections/${keeper.collectionId}`;
    const ids: string[] = [];
    for (let pot = 1; pot <= 24; pot++) {
      const place = (
        await keeper.agent
          .post(`${base}/locations`)
          .send({ room: 'Shelf room', rack: 'C', shelf: 'Tray 1', position: String(pot) })
          .expect(201)
      ).body.id;
      const sling = await keeper.agent
        .post(`${base}/animals`)
        .send({
          name: `Sling ${pot}`,
          scientificName: 'Hapalopus formosus',
          commonName: null,
          group: 'tarantula',
          lifeStage: 'sling',
          sex: 'unknown',
          sizeMm: 10,
          acquiredOn: null,
          source: null,
          locationId: place,
          cautions: [],
          cautionNote: null,
          notes: null,
          clutch: 'Sac 1',
          care: {
            intervalDays: null,
            preyType: null,
            preySize: null,
            preyCount: null,
            hasWaterDish: false,
            doNotFeedUntil: null,
          },
        })
        .expect(201);
      ids.push(sling.body.id);
    }
    // Potted up a week ago: past their settling period (docs/care-rules.md § R16), all due today.
    await ctx.database.db
      .update(animals)
      .set({ createdAt: new Date(Date.now() - 7 * 86_400_000) })
      .where(inArray(animals.id, ids));
    const round = (await keeper.agent.get(`${base}/rounds/today`).expect(200))
      .body as RoundResponse;
    const tray = round.items.filter((i) => ids.includes(i.animal.id));
    expect(tray).toHaveLength(24);
    expect(tray.every((i) => i.tasks.some((t) => t.kind === 'feed'))).toBe(true);

    // On the phone, with no network: the round is cached, then one action for the whole tray.
    const db = await openRacksideDb(`tray-${randomUUID()}`);
    await storeServerRound(db, keeper.userId, keeper.collectionId, 'today', round, new Date());
    const kindOf = (i: number): RecordedEvent['kind'] =>
      i === 4 ? 'refused' : i === 9 ? 'prey_left_in' : 'ate';
    const at = new Date().toISOString();
    const taps = tray.map((item, i) => ({
      userId: keeper.userId,
      byName: 'Test Keeper',
      collectionId: keeper.collectionId,
      animalName: item.animal.name,
      event: {
        id: randomUUID(),
        animalId: item.animal.id,
        kind: kindOf(i),
        payload: {},
        clientRecordedAt: at,
      },
    }));
    const effects = await recordTaps(db, taps);
    expect(effects).toHaveLength(24);
    expect(await waitingTaps(db, keeper.userId)).toHaveLength(24);
    const local = await cachedRound(db, keeper.userId, keeper.collectionId, 'today');
    const fedLocally = local!.round.items.filter(
      (i) => ids.includes(i.animal.id) && i.tasks.find((t) => t.kind === 'feed')?.done,
    );
    expect(fedLocally).toHaveLength(24);

    // The signal returns: flush, and flush again as a retry would.
    const send = async (collectionId: string, body: unknown) => {
      const res = await keeper.agent
        .post(`/api/collections/${collectionId}/events`)
        .send(body as object);
      return { status: res.status, body: res.body as unknown };
    };
    const engine = createSyncEngine({ db: async () => db, userId: keeper.userId, send });
    await engine.flush();
    expect(await waitingTaps(db, keeper.userId)).toHaveLength(0);
    for (const t of taps.slice(0, 3))
      await send(keeper.collectionId, {
        deviceId: 'again',
        clientSentAt: new Date().toISOString(),
        events: [t.event],
      });

    const stored = await ctx.database.db
      .select({ kind: events.kind })
      .from(events)
      .where(and(eq(events.collectionId, keeper.collectionId), inArray(events.animalId, ids)));
    const counts = stored.reduce<Record<string, number>>(
      (c, e) => ({ ...c, [e.kind]: (c[e.kind] ?? 0) + 1 }),
      {},
    );
    expect(counts).toEqual({ ate: 22, refused: 1, prey_left_in: 1 });
    db.close();
  });
});
