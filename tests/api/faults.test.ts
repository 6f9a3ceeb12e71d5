// S2 and S3 (budgets): the server process killed with SIGKILL in the middle of a sync burst,
// and PostgreSQL stopped and started under load. Phones keep each batch until it is
// acknowledged and send it again with the same event ids; afterwards every event is stored
// exactly once, and the server came back from the database outage without a restart.
import { randomUUID } from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import { connectDatabase } from '../../server/db/client';
import { migrateDatabase } from '../../server/db/migrate';
import { createAnimal, insertOwner, PASSWORD } from '../factories';
import { testDatabaseUrl } from '../setup/database-urls';
import { createTestDatabase, dropTestDatabase } from '../setup/test-app';
import { startServerProcess, type ServerProcess } from '../support/server-process';
import { startSpareCluster, type SpareCluster } from '../support/spare-cluster';

const cleanups: (() => Promise<void> | void)[] = [];
afterAll(async () => {
  for (const clean of cleanups.reverse()) await clean();
});

interface Keeper {
  cookie: string;
  collectionId: string;
  animalIds: string[];
}

const headers = (cookie?: string) => ({
  'Content-Type': 'application/json',
  'X-Rackside-Client': '1',
  ...(cookie ? { Cookie: cookie } : {}),
});

async function keeperWithAnimals(
  server: ServerProcess,
  databaseUrl: string,
  count: number,
): Promise<Keeper> {
  const database = connectDatabase(databaseUrl, 1);
  const owner = await insertOwner(database.db);
  const animalIds: string[] = [];
  for (let i = 0; i < count; i++)
    animalIds.push(
      (await createAnimal(database.db, owner.collectionId, { name: `Fault ${i}` })).id,
    );
  await database.close();
  const res = await fetch(`${server.url}/api/auth/sign-in`, {
    method: 'POST',
    headers: headers(),
    body: JSON.stringify({ email: owner.email, password: PASSWORD }),
  });
  expect(res.status).toBe(200);
  return {
    cookie: res.headers.get('set-cookie')!.split(';')[0]!,
    collectionId: owner.collectionId,
    animalIds,
  };
}

interface Burst {
  ids: string[];
  acknowledged: number;
  failedAttempts: number;
  done: Promise<void>;
}

/**
 * Devices sending their taps as the app's outbox does: a batch stays until the server answers
 * it, and is sent again, same ids, after any failure (refused connection, 5xx, timeout).
 */
function syncBurst(
  url: () => string,
  keeper: Keeper,
  devices: number,
  tapsPerDevice: number,
  batchSize: number,
): Burst {
  const burst: Burst = { ids: [], acknowledged: 0, failedAttempts: 0, done: Promise.resolve() };
  const runDevice = async (d: number) => {
    const taps = Array.from({ length: tapsPerDevice }, (_, i) => ({
      id: randomUUID(),
      animalId: keeper.animalIds[(d * tapsPerDevice + i) % keeper.animalIds.length]!,
      kind: 'watered',
      payload: {},
      clientRecordedAt: new Date().toISOString(),
    }));
    burst.ids.push(...taps.map((t) => t.id));
    for (let start = 0; start < taps.length;) {
      const batch = taps.slice(start, start + batchSize);
      try {
        const res = await fetch(`${url()}/api/collections/${keeper.collectionId}/events`, {
          method: 'POST',
          headers: headers(keeper.cookie),
          body: JSON.stringify({
            deviceId: `device-${d}`,
            clientSentAt: new Date().toISOString(),
            events: batch,
          }),
          signal: AbortSignal.timeout(5_000),
        });
        if (res.status !== 200) throw new Error(`status ${res.status}`);
        const { results } = (await res.json()) as { results: { status: string }[] };
        expect(results.every((r) => r.status === 'accepted' || r.status === 'duplicate')).toBe(
          true,
        );
        burst.acknowledged += batch.length;
        start += batchSize;
      } catch {
        burst.failedAttempts++;
        await new Promise((r) => setTimeout(r, 100));
      }
    }
  };
  burst.done = Promise.all(Array.from({ length: devices }, (_, d) => runDevice(d))).then(
    () => undefined,
  );
  return burst;
}

async function storedOnce(databaseUrl: string, ids: string[]) {
  const database = connectDatabase(databaseUrl, 1);
  try {
    const { rows } = await database.pool.query<{ id: string; n: number }>(
      'select id, count(*)::int as n from events where id = any($1) group by id',
      [ids],
    );
    return { distinct: rows.length, doubled: rows.filter((r) => r.n > 1).length };
  } finally {
    await database.close();
  }
}

const until = async (what: () => boolean | Promise<boolean>, timeoutMs: number) => {
  const deadline = Date.now() + timeoutMs;
  while (!(await what())) {
    if (Date.now() > deadline) throw new Error('timed out waiting');
    await new Promise((r) => setTimeout(r, 20));
  }
};

describe('S2: the server killed in the middle of a sync burst', () => {
  it('stores every event exactly once after the phones retry against the restarted server', async () => {
    const name = await createTestDatabase();
    const databaseUrl = testDatabaseUrl(name);
    cleanups.push(() => dropTestDatabase(name));
    let server = await startServerProcess({ databaseUrl });
    cleanups.push(() => server.kill());
    const keeper = await keeperWithAnimals(server, databaseUrl, 20);

    const burst = syncBurst(() => server.url, keeper, 10, 60, 6);
    await until(() => burst.acknowledged >= 120, 30_000);
    const killedAfter = burst.acknowledged;
    await server.kill('SIGKILL');
    // The new process takes the same address, as a supervisor would restart it.
    server = await startServerProcess({ databaseUrl, port: server.port });
    await burst.done;

    expect(killedAfter).toBeLessThan(600);
    expect(burst.failedAttempts).toBeGreaterThan(0);
    expect(burst.ids).toHaveLength(600);
    expect(await storedOnce(databaseUrl, burst.ids)).toEqual({ distinct: 600, doubled: 0 });
  }, 120_000);
});

describe('S3: PostgreSQL stopped and started under load', () => {
  it('reports the outage on /api/health, answers 503 meanwhile, recovers without a restart, and loses nothing', async () => {
    const cluster: SpareCluster = await startSpareCluster();
    cleanups.push(() => cluster.destroy());
    const database = connectDatabase(cluster.url, 1);
    await migrateDatabase(database.db);
    await database.close();
    const server = await startServerProcess({ databaseUrl: cluster.url });
    cleanups.push(() => server.kill());
    const keeper = await keeperWithAnimals(server, cluster.url, 20);

    // Readers of today's round alongside the syncing phones.
    let reading = true;
    const readStatuses: number[] = [];
    const readers = Promise.all(
      Array.from({ length: 4 }, async () => {
        while (reading) {
          const res = await fetch(
            `${server.url}/api/collections/${keeper.collectionId}/rounds/today`,
            { headers: headers(keeper.cookie) },
          ).catch(() => null);
          if (res) {
            readStatuses.push(res.status);
            if (res.status >= 500) {
              const body = (await res.json()) as { error: { message: string } };
              expect(body.error.message).toMatch(/cannot reach its database/);
            } else await res.arrayBuffer();
          }
          await new Promise((r) => setTimeout(r, 20));
        }
      }),
    );
    const burst = syncBurst(() => server.url, keeper, 5, 60, 4);
    await until(() => burst.acknowledged >= 60, 30_000);

    cluster.stop();
    const down = await fetch(`${server.url}/api/health`).catch((err: unknown) => {
      throw new Error(
        `the server died with the database: ${String(err)}\n${server.lines.slice(-30).join('\n')}`,
      );
    });
    expect(down.status).toBe(503);
    expect(await down.json()).toMatchObject({ database: 'down' });
    await new Promise((r) => setTimeout(r, 1_000));
    cluster.start();
    await until(async () => (await fetch(`${server.url}/api/health`)).status === 200, 30_000);
    await burst.done;
    reading = false;
    await readers;

    // The same process throughout: it recovered by itself.
    expect(server.child.exitCode).toBeNull();
    expect(readStatuses).toContain(200);
    expect(readStatuses).toContain(503);
    // Nothing but 200 and 503 (never a bare 500) while the database came and went.
    expect([...new Set(readStatuses)].filter((s) => s !== 200 && s !== 503)).toEqual([]);
    expect(burst.failedAttempts).toBeGreaterThan(0);
    expect(await storedOnce(cluster.url, burst.ids)).toEqual({ distinct: 300, doubled: 0 });
  }, 120_000);
});
