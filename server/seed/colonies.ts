// The demo's feeder colonies in Tub D (demo scenario): a dubia roach colony and a cricket bin,
// with a few weeks of counts and care behind them. The cricket bin holds fewer large crickets
// than the demo's adults eat tomorrow, so tomorrow's prep list warns and names it.
import { randomUUID } from 'node:crypto';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import { addDays, startOfLocalDate, type LocalDate } from '#shared/domain/local-dates';
import { chores, colonies, colonyStock, colonyStockChanges } from '../db/schema/colonies';

interface DemoColony {
  name: string;
  species: string;
  preyType: string;
  every: {
    feed: number | null;
    waterGel: number | null;
    clean: number | null;
    split: number | null;
  };
  /** Counts per size at each check, oldest first: [days ago, { size: count }]. */
  checks: [number, Record<string, number>][];
  /** Days ago each care kind was last done (absent: never). */
  lastDone: Partial<Record<'feed' | 'water_gel' | 'clean' | 'split', number>>;
}

export const DEMO_COLONIES: DemoColony[] = [
  {
    name: 'Dubia colony',
    species: 'Blaptica dubia',
    preyType: 'roach',
    every: { feed: 3, waterGel: 3, clean: 14, split: 60 },
    checks: [
      [21, { 'small nymph': 80, 'medium nymph': 40, 'large nymph': 25, adult: 50 }],
      [12, { 'small nymph': 95, 'medium nymph': 38, 'large nymph': 22, adult: 48 }],
      [4, { 'small nymph': 110, 'medium nymph': 42, 'large nymph': 20, adult: 45 }],
    ],
    // Fed three days ago: due today. Cleaned ten days ago; split five weeks ago.
    lastDone: { feed: 3, water_gel: 1, clean: 10, split: 35 },
  },
  {
    name: 'Cricket bin',
    species: 'Acheta domesticus',
    preyType: 'cricket',
    every: { feed: 2, waterGel: 2, clean: 7, split: null },
    checks: [
      [14, { pinhead: 60, small: 50, medium: 40, large: 30 }],
      [7, { pinhead: 45, small: 40, medium: 35, large: 16 }],
      // Large ones are running out: tomorrow's adults need up to 12.
      [2, { pinhead: 30, small: 28, medium: 30, large: 7 }],
    ],
    lastDone: { feed: 1, water_gel: 2, clean: 5 },
  },
];

export async function seedColonies(
  tx: NodePgDatabase,
  collectionId: string,
  userId: string,
  today: LocalDate,
  zone: string,
) {
  const at = (daysAgo: number, hour: number) =>
    new Date(startOfLocalDate(addDays(today, -daysAgo), zone).getTime() + hour * 3_600_000);
  for (const c of DEMO_COLONIES) {
    const [row] = await tx
      .insert(colonies)
      .values({
        collectionId,
        name: c.name,
        species: c.species,
        preyType: c.preyType,
        feedEvery: c.every.feed,
        waterGelEvery: c.every.waterGel,
        cleanEvery: c.every.clean,
        splitEvery: c.every.split,
        createdAt: at(c.checks[0]![0], 9),
        updatedAt: at(c.checks.at(-1)![0], 9),
      })
      .returning({ id: colonies.id });
    const colonyId = row!.id;
    const held: Record<string, number> = {};
    for (const [daysAgo, counts] of c.checks) {
      for (const [preySize, count] of Object.entries(counts)) {
        const delta = count - (held[preySize] ?? 0);
        held[preySize] = count;
        await tx.insert(colonyStockChanges).values({
          colonyId,
          preySize,
          delta,
          after: count,
          reason: 'count',
          at: at(daysAgo, 9),
        });
      }
    }
    await tx.insert(colonyStock).values(
      Object.entries(held).map(([preySize, count], position) => ({
        colonyId,
        preySize,
        count,
        position,
      })),
    );
    const done = Object.entries(c.lastDone).map(([kind, daysAgo]) => ({
      id: randomUUID(),
      collectionId,
      subjectKind: 'colony',
      subjectId: colonyId,
      kind,
      payload: {},
      recordedBy: userId,
      deviceId: 'demo-seed',
      clientRecordedAt: at(daysAgo, 18),
      serverReceivedAt: at(daysAgo, 18),
      effectiveAt: at(daysAgo, 18),
    }));
    if (done.length) await tx.insert(chores).values(done);
  }
}
