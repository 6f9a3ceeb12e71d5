// The demo obeys the rules it demonstrates (docs/care-rules.md): no meal in its history was
// given while the round engine would have withheld food, and "today" shows every group and the
// breeding states the scenario asks for (a mature male, a guarding female, a scorpion brood, a
// mantis egg case). The rules themselves are common practice, no published source.
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { localDateOf } from '#shared/domain/local-dates';
import { projectState, type EngineEvent } from '#shared/domain/rounds/animal-state';
import {
  decideAnimal,
  FEED_HOLD_CODES,
  type EngineAnimal,
} from '#shared/domain/rounds/build-round';
import { effectiveRules, type RulesOverride } from '#shared/domain/rounds/rules';
import { animals, eggSacs, events } from '../../server/db/schema/animals';
import { collections } from '../../server/db/schema/collections';
import { toAnimalSummary } from '../../server/features/animals/animal-summary';
import { demoCollectionId, seedDemo } from '../../server/seed/demo';
import { createTestContext, type TestContext } from '../setup/test-app';

const ZONE = 'America/Toronto';
let ctx: TestContext;
let demoId: string;

beforeAll(async () => {
  ctx = await createTestContext();
  await seedDemo(ctx.database.db, { bcryptCost: 10 });
  demoId = (await demoCollectionId(ctx.database.db))!;
});
afterAll(async () => {
  await ctx.close();
});

describe('the demo collection', () => {
  it('never fed an animal while the engine withheld food', async () => {
    const db = ctx.database.db;
    const [collection] = await db.select().from(collections).where(eq(collections.id, demoId));
    const rules = effectiveRules(collection!.rules as RulesOverride);
    const rows = await db.select().from(animals).where(eq(animals.collectionId, demoId));
    const log = await db.select().from(events).where(eq(events.collectionId, demoId));
    const breaches: string[] = [];
    for (const row of rows) {
      const animal: EngineAnimal = {
        ...toAnimalSummary(row, null),
        addedOn: localDateOf(row.createdAt, ZONE),
      };
      const mine: EngineEvent[] = log
        .filter((e) => e.animalId === row.id)
        .map((e) => ({
          id: e.id,
          kind: e.kind as EngineEvent['kind'],
          effectiveAt: e.effectiveAt.toISOString(),
          payload: e.payload as Record<string, unknown>,
        }))
        .sort((a, b) => a.effectiveAt.localeCompare(b.effectiveAt));
      for (const [i, meal] of mine.entries()) {
        if (meal.kind !== 'ate') continue;
        const day = localDateOf(new Date(meal.effectiveAt), ZONE);
        const d = decideAnimal(animal, projectState(mine.slice(0, i), ZONE), rules, day);
        const hold = [...d.notes, ...d.tasks.flatMap((t) => t.reasons)].find((r) =>
          FEED_HOLD_CODES.has(r.code),
        );
        if (hold) breaches.push(`${row.name} ate on ${day}: ${hold.text}`);
      }
    }
    expect(breaches).toEqual([]);
  });

  it('shows every group of the scenario and its breeding states on today’s round', async () => {
    const db = ctx.database.db;
    const rows = await db.select().from(animals).where(eq(animals.collectionId, demoId));
    expect(new Set(rows.map((a) => a.group))).toEqual(
      new Set(['tarantula', 'centipede', 'scorpion', 'mantis']),
    );
    const records = await db
      .select({ kind: eggSacs.kind, femaleId: eggSacs.femaleId })
      .from(eggSacs)
      .where(eq(eggSacs.collectionId, demoId));
    const nameOf = (id: string) => rows.find((a) => a.id === id)!.name;
    expect(records.map((r) => `${r.kind}:${nameOf(r.femaleId)}`).sort()).toEqual([
      'brood:Pinch',
      'egg_case:Mantra',
      'egg_sac:Juniper',
      // The mother of the 24-sling clutch: her pulled sac keeps the breeding register honest.
      'egg_sac:Marigold',
      'egg_sac:Pepper',
    ]);

    const owner = ctx.agent();
    await owner
      .post('/api/auth/sign-in')
      .send({
        email: 'owner@northlight.test',
        password: (await import('../../server/access/demo-people')).DEMO_PASSWORD,
      })
      .expect(200);
    const round = (await owner.get(`/api/collections/${demoId}/rounds/today`).expect(200)).body;
    type Item = {
      animal: { name: string };
      tasks: { kind: string; reasons: { text: string }[] }[];
      notes: { code: string }[];
    };
    const item = (name: string) =>
      round.items.find((i: Item) => i.animal.name === name) as Item | undefined;
    // Guarding a fresh sac, and a scorpion carrying her brood: left alone (R11).
    expect(item('Pepper')!.tasks[0]!.reasons[0]!.text).toMatch(
      /^Guarding an egg sac since .*: leave alone/,
    );
    expect(item('Pinch')!.tasks[0]!.reasons[0]!.text).toMatch(
      /^Carrying her brood since .*: leave alone/,
    );
    // The mature male: refusing is normal (R17).
    const blueJay = rows.find((a) => a.name === 'Blue Jay')!;
    const schedule = (
      await owner.get(`/api/collections/${demoId}/animals/${blueJay.id}/schedule`).expect(200)
    ).body;
    expect(schedule.notes.map((n: { code: string }) => n.code)).toContain('mature_male');
  });
  it('keeps a dubia colony and a cricket bin, the bin short of large crickets for tomorrow', async () => {
    const { drawPrepList, shortWarning } = await import('#shared/domain/colonies/stock');
    const { dueCare } = await import('#shared/domain/colonies/care');
    const tomorrow = await ctx.services.rounds.tomorrowPreview(demoId);
    const list = await ctx.services.colonies.list({ collectionId: demoId, timeZone: ZONE });
    expect(list.colonies.map((c) => c.name)).toEqual(['Cricket bin', 'Dubia colony']);
    const drawn = drawPrepList(
      tomorrow.prepList,
      list.colonies.map((c) => ({
        ...c,
        stock: Object.fromEntries(c.stock.map((s) => [s.preySize, s.count])),
      })),
    );
    const warnings = drawn.map(shortWarning).filter(Boolean);
    expect(warnings).toEqual([expect.stringMatching(/large cricket.*Cricket bin 7/)]);
    // Some colony care is due on the demo's today, so the Colonies section shows.
    const due = list.colonies.flatMap((c) => dueCare(c.intervals, c.lastDone, list.today));
    expect(due.length).toBeGreaterThan(0);
  });
});
