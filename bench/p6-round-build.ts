// P6: build tomorrow's round for one collection of 10,000 animals with a year of history
// (~1M events), and for 20,000 animals (should grow linearly: ≤ 2.2 × the 10,000 figure).
import { performance } from 'node:perf_hooks';
import { eq, sql } from 'drizzle-orm';
import { generateLabelTag } from '#shared/domain/labels/label-payload';
import { addDays, localDateOf } from '#shared/domain/local-dates';
import { buildRound } from '#shared/domain/rounds/build-round';
import { DEFAULT_RULES } from '#shared/domain/rounds/rules';
import type { Database } from '../server/db/client';
import { rounds } from '../server/db/schema/rounds';
import { refoldStates } from '../server/features/events/projection';
import { loadAnimalsWithState } from '../server/features/rounds/rounds.repository';
import { createRoundsService } from '../server/features/rounds/rounds.service';
import { median, type Figure } from './results-file';

const ZONE = 'America/Toronto';
const EVENTS_PER_ANIMAL = 100; // a year at one event every ~3.65 days

async function makeCollection(database: Database, animals: number): Promise<string> {
  const { pool } = database;
  const inserted = await pool.query<{ id: string }>(
    `insert into collections (name, time_zone, label_tag) values ($1, $2, $3) returning id`,
    [`Bench ${animals}`, ZONE, generateLabelTag(Math.random)],
  );
  const id = inserted.rows[0]!.id;
  await pool.query(
    `insert into locations (collection_id, room, rack, shelf, position)
     select $1, 'Room ' || (g / 2000), 'R' || ((g / 100) % 20), (g / 10) % 10, g % 10 from generate_series(0, $2 - 1) g`,
    [id, animals],
  );
  await pool.query(
    `insert into animals (collection_id, label_code, name, scientific_name, "group", life_stage, sex, size_mm, location_id, has_water_dish, created_at)
     select $1, 'B-' || l.rn, 'Animal ' || l.rn, 'Tliltocatl albopilosus', 'tarantula',
            (array['sling','juvenile','subadult','adult'])[1 + l.rn % 4]::life_stage, 'female',
            (array[12, 40, 80, 130])[1 + l.rn % 4], l.id, l.rn % 4 >= 2, now() - interval '400 days'
     from (select id, row_number() over (order by id) as rn from locations where collection_id = $1) l`,
    [id],
  );
  // A year of history per animal: meals, refusals, waterings and the odd molt.
  await pool.query(
    `insert into events (id, collection_id, animal_id, kind, payload, client_recorded_at, effective_at, server_received_at)
     select gen_random_uuid(), $1, a.id,
            case when k % 50 = 7 then 'molted' when k % 9 = 0 then 'refused' when k % 3 = 0 then 'watered' else 'ate' end,
            '{}'::jsonb, t, t, t
     from animals a
     cross join generate_series(1, $2) k
     cross join lateral (select now() - make_interval(secs => k * 315360 + (hashtext(a.id::text) % 3600))) as x(t)
     where a.collection_id = $1`,
    [id, EVENTS_PER_ANIMAL],
  );
  await pool.query('analyze');
  await refoldStates(database.db, id, ZONE);
  return id;
}

/** The slow road, for comparison: last meal, last molt and trailing refusals from the log. */
async function lateralBaseline(database: Database, collectionId: string): Promise<number> {
  const t = performance.now();
  await database.pool.query(
    `select a.id, m.last_meal, mo.last_molt, r.refusals
     from animals a
     left join lateral (select max(effective_at) last_meal from events e where e.animal_id = a.id and e.kind = 'ate') m on true
     left join lateral (select max(effective_at) last_molt from events e where e.animal_id = a.id and e.kind = 'molted') mo on true
     left join lateral (select count(*) refusals from events e where e.animal_id = a.id and e.kind = 'refused'
                        and e.effective_at > coalesce(m.last_meal, '-infinity')) r on true
     where a.collection_id = $1`,
    [collectionId],
  );
  return performance.now() - t;
}

async function measure(database: Database, collectionId: string, runs: number) {
  const service = createRoundsService(database.db, () => new Date());
  const date = addDays(localDateOf(new Date(), ZONE), 1);
  const totals: number[] = [];
  const queries: number[] = [];
  const engines: number[] = [];
  let items = 0;
  for (let i = 0; i < runs; i++) {
    await database.db.delete(rounds).where(eq(rounds.collectionId, collectionId));
    const t0 = performance.now();
    await service.build(collectionId, date);
    totals.push(performance.now() - t0);
    // The same work split into its parts (outside the timed build).
    const q0 = performance.now();
    const rows = await loadAnimalsWithState(database.db, collectionId);
    queries.push(performance.now() - q0);
    const e0 = performance.now();
    const round = buildRound(
      rows.map((r) => ({
        animal: {
          ...r.animal,
          cautions: [],
          location: r.location ? { ...r.location } : null,
          addedOn: null,
        },
        state: r.state as never,
      })),
      DEFAULT_RULES,
      date,
    );
    engines.push(performance.now() - e0);
    items = round.items.length;
  }
  const [{ n }] = (
    await database.db.execute<{ n: number }>(
      sql`select count(*)::int as n from events where collection_id = ${collectionId}`,
    )
  ).rows as [{ n: number }];
  return {
    total: median(totals),
    query: median(queries),
    engine: median(engines),
    items,
    events: n,
  };
}

export async function runP6(database: Database): Promise<{ figures: Figure[]; notes: string[] }> {
  const small = await makeCollection(database, 10_000);
  const a = await measure(database, small, 5);
  const baseline10k = median([
    await lateralBaseline(database, small),
    await lateralBaseline(database, small),
    await lateralBaseline(database, small),
  ]);
  const large = await makeCollection(database, 20_000);
  const b = await measure(database, large, 5);
  const ratio = Number((b.total / a.total).toFixed(2));
  const round = (x: number) => Math.round(x);
  return {
    figures: [
      {
        id: 'P6',
        what: `build tomorrow's round: 10,000 animals, ${a.events.toLocaleString('en')} events (${a.items} items)`,
        value: round(a.total),
        unit: 'ms',
        target: 1000,
        baseline: round(baseline10k),
        ratio: Number((a.total / baseline10k).toFixed(2)),
        pass: a.total <= 1000,
      },
      {
        id: 'P6-20k',
        what: `build tomorrow's round: 20,000 animals, ${b.events.toLocaleString('en')} events (${b.items} items)`,
        value: round(b.total),
        unit: 'ms',
        target: '≤ 2.2 × P6',
        baseline: round(a.total),
        ratio,
        pass: ratio <= 2.2,
      },
    ],
    notes: [
      `P6 split (10,000): loading animals + projected states ${round(a.query)} ms, engine ${round(a.engine)} ms; the rest is writing ${a.items} round items in one transaction.`,
      `P6 split (20,000): loading ${round(b.query)} ms, engine ${round(b.engine)} ms.`,
      `P6 baseline: the per-animal LATERAL query over the event log (last meal, last molt, trailing refusals) for the same 10,000 animals; ratio = build ÷ that query. The projection table is why the build reads O(animals), not O(events).`,
    ],
  };
}
