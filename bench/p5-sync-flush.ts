// P5: 1,000 queued taps → server → acknowledged → outbox empty, with the real client outbox
// (fake-indexeddb) and sync engine against the real server; and server ingestion against a raw
// multi-row INSERT of the same rows with pg, in the same run.
import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import { performance } from 'node:perf_hooks';
import { localDateOf } from '#shared/domain/local-dates';
import { SYNC_BATCH_SIZE } from '#shared/domain/sync-limits';
import type { RecordedEvent } from '#shared/schemas/events';
import { findMembership } from '../server/access/memberships';
import type { Database } from '../server/db/client';
import { createEventsService } from '../server/features/events/events.service';
import { createRoundsService } from '../server/features/rounds/rounds.service';
import { animalsToReconcile } from '../server/features/rounds/urgent-tasks';
import { openRacksideDb } from '../src/lib/db';
import { recordTap, waitingTaps } from '../src/lib/outbox';
import { createSyncEngine, type SyncTransport } from '../src/lib/sync';
import { makeKeeper, signInCookie, startBenchApp } from './bench-app';
import { median, type Figure } from './results-file';

const TAPS = 1000;
const RUNS = 5;
const KINDS: RecordedEvent['kind'][] = [
  'ate',
  'refused',
  'watered',
  'prey_left_in',
  'prey_removed',
];

// Taps come in the order they were made, as on a real round (a late phone is the rare case).
let clock = Date.now() - 3_600_000;

function taps(animalIds: string[], n: number): RecordedEvent[] {
  return Array.from({ length: n }, (_, i) => ({
    id: randomUUID(),
    animalId: animalIds[i % animalIds.length]!,
    kind: KINDS[i % KINDS.length]!,
    payload: {},
    clientRecordedAt: new Date((clock += 1)).toISOString(),
  }));
}

export async function runP5(database: Database): Promise<{ figures: Figure[]; notes: string[] }> {
  const app = await startBenchApp(database);
  try {
    const keeper = await makeKeeper(database, 150, 'p5');
    const cookie = await signInCookie(app.baseUrl, keeper.email);
    const send: SyncTransport = async (collectionId, body) => {
      const res = await fetch(`${app.baseUrl}/api/collections/${collectionId}/events`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json', 'X-Rackside-Client': '1', Cookie: cookie },
        body: JSON.stringify(body),
      });
      return { status: res.status, body: await res.json() };
    };
    // As in real use, today's round exists while taps arrive (urgent tasks are checked against it).
    const today = await fetch(
      `${app.baseUrl}/api/collections/${keeper.collectionId}/rounds/today`,
      { headers: { Cookie: cookie } },
    );
    if (today.status !== 200) throw new Error(`P5 could not build today's round: ${today.status}`);
    // Warm-up: the first requests pay for connections, JIT and caches.
    await send(keeper.collectionId, {
      deviceId: 'bench',
      clientSentAt: new Date().toISOString(),
      events: taps(keeper.animalIds, 200),
    });

    // The ingestion service on its own (no HTTP, session or JSON), to show where time goes.
    // Wired as server/app.ts wires it: meals checked against holds, today's round reconciled.
    const rounds = createRoundsService(database.db, () => new Date());
    const service = createEventsService(database.db, {
      now: () => new Date(),
      feedHolds: rounds.feedHolds,
      onRecorded: [
        (c, recorded, batch) =>
          rounds.reconcileToday(
            c.collectionId,
            animalsToReconcile(recorded, c.timeZone, localDateOf(new Date(), c.timeZone)),
            batch,
          ),
      ],
    });
    const member = (await findMembership(database.db, keeper.collectionId, keeper.userId))!;
    const flushMs: number[] = [];
    const serverMs: number[] = [];
    const serviceMs: number[] = [];
    const rawMs: number[] = [];
    for (let run = 0; run < RUNS; run++) {
      // End to end: taps already queued on the "phone", then one flush until the outbox is empty.
      const db = await openRacksideDb(`p5-${randomUUID()}`);
      for (const event of taps(keeper.animalIds, TAPS)) {
        await recordTap(db, {
          userId: keeper.userId,
          byName: 'Bench keeper',
          collectionId: keeper.collectionId,
          animalName: 'Animal',
          event,
        });
      }
      const engine = createSyncEngine({ db: async () => db, userId: keeper.userId, send });
      const t0 = performance.now();
      const result = await engine.flush();
      flushMs.push(performance.now() - t0);
      if (
        !result.ok ||
        result.acknowledged !== TAPS ||
        (await waitingTaps(db, keeper.userId)).length
      )
        throw new Error(`P5 flush did not empty the outbox: ${JSON.stringify(result)}`);
      db.close();

      // Server ingestion alone: the same five 200-event requests the engine sends.
      const serverEvents = taps(keeper.animalIds, TAPS);
      const t1 = performance.now();
      for (let i = 0; i < TAPS; i += SYNC_BATCH_SIZE) {
        const res = await send(keeper.collectionId, {
          deviceId: 'bench',
          clientSentAt: new Date().toISOString(),
          events: serverEvents.slice(i, i + SYNC_BATCH_SIZE),
        });
        if (res.status !== 200) throw new Error(`P5 batch answered ${res.status}`);
      }
      serverMs.push(performance.now() - t1);

      const serviceEvents = taps(keeper.animalIds, TAPS);
      const t3 = performance.now();
      for (let i = 0; i < TAPS; i += SYNC_BATCH_SIZE) {
        await service.recordBatch(member, keeper.userId, {
          deviceId: 'bench',
          clientSentAt: new Date().toISOString(),
          events: serviceEvents.slice(i, i + SYNC_BATCH_SIZE),
        });
      }
      serviceMs.push(performance.now() - t3);

      // Baseline: the same rows as raw multi-row INSERT … ON CONFLICT DO NOTHING, one transaction per batch.
      const rawEvents = taps(keeper.animalIds, TAPS);
      const t2 = performance.now();
      for (let i = 0; i < TAPS; i += SYNC_BATCH_SIZE) {
        const slice = rawEvents.slice(i, i + SYNC_BATCH_SIZE);
        const values: unknown[] = [];
        const rows = slice.map((e, j) => {
          values.push(
            e.id,
            keeper.collectionId,
            e.animalId,
            e.kind,
            '{}',
            keeper.userId,
            'bench',
            e.clientRecordedAt,
            new Date().toISOString(),
            e.clientRecordedAt,
          );
          const b = j * 10;
          return `($${b + 1}, $${b + 2}, $${b + 3}, $${b + 4}, $${b + 5}::jsonb, $${b + 6}, $${b + 7}, $${b + 8}, $${b + 9}, $${b + 10})`;
        });
        await database.pool.query(
          `insert into events (id, collection_id, animal_id, kind, payload, recorded_by, device_id, client_recorded_at, client_sent_at, effective_at) values ${rows.join(', ')} on conflict (id) do nothing`,
          values,
        );
      }
      rawMs.push(performance.now() - t2);
    }
    const flush = Math.round(median(flushMs));
    const server = median(serverMs);
    const raw = median(rawMs);
    const ratio = Number((raw / server).toFixed(2));
    const serviceOnly = median(serviceMs);
    const serviceRatio = Number((raw / serviceOnly).toFixed(2));
    return {
      figures: [
        {
          id: 'P5',
          what: `flush of ${TAPS} queued taps until the outbox is empty (median of ${RUNS})`,
          value: flush,
          unit: 'ms',
          target: 2000,
          pass: flush <= 2000,
        },
        {
          id: 'P5',
          what: `server ingestion of ${TAPS} events in ${TAPS / SYNC_BATCH_SIZE} requests, as throughput relative to raw multi-row INSERT`,
          value: Math.round(server),
          unit: 'ms',
          target: 'ratio ≥ 0.5',
          baseline: Math.round(raw),
          ratio,
          pass: ratio >= 0.5,
        },
        {
          id: 'P5',
          what: `ingestion service alone (no HTTP or session) for the same ${TAPS} events, relative to raw multi-row INSERT`,
          value: Math.round(serviceOnly),
          unit: 'ms',
          target: 'ratio ≥ 0.5',
          baseline: Math.round(raw),
          ratio: serviceRatio,
          pass: serviceRatio >= 0.5,
        },
      ],
      notes: [
        `P5 runs: flush ${flushMs.map(Math.round).join(', ')} ms; server over HTTP ${serverMs.map(Math.round).join(', ')} ms; service alone ${serviceMs.map(Math.round).join(', ')} ms; raw INSERT ${rawMs.map(Math.round).join(', ')} ms.`,
      ],
    };
  } finally {
    await app.close();
  }
}
