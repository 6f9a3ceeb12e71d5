// The daily job builds every collection's round: one collection whose build throws (rules no
// API would accept, left by a hand edit or an older version) is logged with its id, and the
// others still get their rounds.
import { Writable } from 'node:stream';
import { eq, inArray } from 'drizzle-orm';
import pino from 'pino';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { collections } from '../../server/db/schema/collections';
import { rounds as roundsTable } from '../../server/db/schema/rounds';
import { buildDueRoundsJob } from '../../server/jobs/jobs';
import { createAnimal, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let healthy: SignedUp[];
let poisoned: SignedUp;

function memoryLogger() {
  const lines: Record<string, unknown>[] = [];
  const logger = pino(
    { level: 'info' },
    new Writable({
      write(chunk: Buffer, _encoding, done) {
        lines.push(
          ...chunk
            .toString()
            .split('\n')
            .filter(Boolean)
            .map((l) => JSON.parse(l) as Record<string, unknown>),
        );
        done();
      },
    }),
  );
  return { logger, lines };
}

const roundsOf = async (ids: string[]) =>
  (
    await ctx.database.db
      .select({ c: roundsTable.collectionId })
      .from(roundsTable)
      .where(inArray(roundsTable.collectionId, ids))
  )
    .map((r) => r.c)
    .sort();

beforeAll(async () => {
  ctx = await createTestContext();
  // Several healthy collections, so whatever order the job meets them in, some come after the poisoned one.
  healthy = [await signUp(ctx), await signUp(ctx), await signUp(ctx)];
  poisoned = await signUp(ctx);
  for (const c of [...healthy, poisoned])
    await createAnimal(ctx.database.db, c.collectionId, { lifeStage: 'adult' });
  // An adult's offer that is not an offer: the rules schema refuses it, the engine trips on it.
  await ctx.database.db
    .update(collections)
    .set({ rules: { offers: { adult: null } } })
    .where(eq(collections.id, poisoned.collectionId));
});
afterAll(async () => {
  await ctx.close();
});

describe('the daily round job', () => {
  it('builds the healthy collections and logs the poisoned one with its id', async () => {
    const { logger, lines } = memoryLogger();
    const result = await buildDueRoundsJob(ctx.services.rounds, logger, 'job-1');
    const healthyIds = healthy.map((h) => h.collectionId).sort();
    expect(result.built.sort()).toEqual(healthyIds);
    expect(result.failed).toBe(1);
    expect(await roundsOf(healthyIds)).toEqual(healthyIds);
    expect(await roundsOf([poisoned.collectionId])).toEqual([]);

    const errors = lines.filter((l) => l.level === 50);
    expect(errors).toHaveLength(1);
    expect(errors[0]).toMatchObject({
      collectionId: poisoned.collectionId,
      jobId: 'job-1',
      msg: 'round build failed for one collection',
    });
    expect((errors[0]!.err as { message: string }).message).toBeTruthy();
    expect(lines.find((l) => l.msg === 'job done')).toMatchObject({ collections: 3, failed: 1 });
  });

  it('tries the poisoned collection again next time, and reports it to a caller without a log', async () => {
    // The service alone still builds what it can, then says that something failed.
    await expect(ctx.services.rounds.buildDueRounds()).rejects.toThrow(
      /1 collection\(s\) could not have their round built/,
    );
    await ctx.database.db
      .update(collections)
      .set({ rules: {} })
      .where(eq(collections.id, poisoned.collectionId));
    expect(await ctx.services.rounds.buildDueRounds()).toEqual([poisoned.collectionId]);
  });
});
