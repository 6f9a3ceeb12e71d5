// Issue 9, S7: a keeper can leave with all their data. The whole demo collection — adults,
// juveniles, a clutch of slings, refusals, molts, a sac, a pairing, covers — goes out as CSV
// (RFC 4180) and as a backup, and comes back into an empty collection unchanged.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { rowToAnimal } from '#shared/domain/csv/animal-columns';
import { readCsv } from '#shared/domain/csv/csv-file';
import { DEMO_PASSWORD } from '../../server/access/demo-people';
import { demoCollectionId, seedDemo } from '../../server/seed/demo';
import { signUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';
import { withOriginalIds } from '../support/backup-compare';

let ctx: TestContext;
let demo: string;
let owner: ReturnType<TestContext['agent']>;

beforeAll(async () => {
  ctx = await createTestContext();
  await seedDemo(ctx.database.db, { bcryptCost: 10 });
  demo = `/api/collections/${(await demoCollectionId(ctx.database.db))!}`;
  owner = ctx.agent();
  await owner
    .post('/api/auth/sign-in')
    .send({ email: 'owner@northlight.test', password: DEMO_PASSWORD })
    .expect(200);
});
afterAll(async () => {
  await ctx.close();
});

describe('S7: the full demo collection, out and back in', () => {
  it('round-trips the animals CSV byte for byte through an empty collection', async () => {
    const csv = (await owner.get(`${demo}/export/animals.csv`).expect(200)).text;
    const table = readCsv(csv);
    expect(table.records.length).toBeGreaterThanOrEqual(40);
    const rows = table.records.map((r) => {
      const result = rowToAnimal(Object.fromEntries(table.headers.map((h, i) => [h, r.cells[i]!])));
      if (!result.ok) throw new Error(`line ${r.line}: ${result.errors.join('; ')}`);
      return result.value;
    });
    const to = await signUp(ctx);
    await to.agent
      .post(`/api/collections/${to.collectionId}/animals/import`)
      .send({ rows })
      .expect(201);
    expect(
      (await to.agent.get(`/api/collections/${to.collectionId}/export/animals.csv`).expect(200))
        .text,
    ).toBe(csv);
  });

  it('restores the backup into an empty collection: the same records, history and events CSV', async () => {
    const backup = (await owner.get(`${demo}/backup`).expect(200)).body;
    expect(backup.events.length).toBeGreaterThan(100);
    // The demo's feeder colonies with their counts and care, and its rooms' climate, go along.
    expect(backup.colonies.length).toBeGreaterThan(0);
    expect(backup.colonyStockChanges.length).toBeGreaterThan(0);
    expect(backup.chores.length).toBeGreaterThan(0);
    expect(backup.roomTargets.length).toBeGreaterThan(0);
    expect(backup.climateReadings.length).toBeGreaterThan(0);
    const to = await signUp(ctx);
    const c = `/api/collections/${to.collectionId}`;
    const restored = await to.agent.post(`${c}/restore`).send(backup).expect(201);
    expect(restored.body).toEqual({ animals: backup.animals.length, events: backup.events.length });
    const copy = (await to.agent.get(`${c}/backup`).expect(200)).body;
    const back = withOriginalIds(backup, copy);
    expect({ ...back, exportedAt: null, collection: null }).toEqual({
      ...backup,
      exportedAt: null,
      collection: null,
    });
    expect(back.collection.rules).toEqual(backup.collection.rules);

    // The events CSV of the copy says the same as the original's, event ids aside (and the ids
    // of the breeding records the facts name: the copy's records have ids of their own).
    const withoutIds = (csv: string) =>
      readCsv(csv)
        .records.map((r) =>
          r.cells
            .slice(1)
            .join('\u0000')
            .replace(/"sacId":"[0-9a-f-]{36}"/g, '"sacId":"(record)"'),
        )
        .sort();
    const original = (await owner.get(`${demo}/export/events.csv`).expect(200)).text;
    const copied = (await to.agent.get(`${c}/export/events.csv`).expect(200)).text;
    expect(withoutIds(copied)).toEqual(withoutIds(original));
  });
});
