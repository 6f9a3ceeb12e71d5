// OFF-1k (issue 22, decision 015): what a keeper's phone keeps to build the next days with no
// signal, for a 1,000-animal collection with a history — bytes stored, bytes over the wire,
// and the time the shared engine takes to build a day from it.
import { randomUUID } from 'node:crypto';
import { performance } from 'node:perf_hooks';
import { gzipSync } from 'node:zlib';
import { addDays } from '#shared/domain/local-dates';
import { phoneRound } from '#shared/domain/rounds/phone-round';
import { engineInputResponse } from '#shared/schemas/rounds';
import type { Database } from '../server/db/client';
import { makeKeeper, signInCookie, startBenchApp } from './bench-app';
import { median, type Figure } from './results-file';

const ANIMALS = 1_000;
const DAY_MS = 86_400_000;

export async function runOffEngineInput(database: Database) {
  const app = await startBenchApp(database);
  try {
    const keeper = await makeKeeper(database, ANIMALS, 'off');
    const cookie = await signInCookie(app.baseUrl, keeper.email);
    const headers = { Cookie: cookie, 'X-Rackside-Client': '1' };
    const base = `${app.baseUrl}/api/collections/${keeper.collectionId}`;
    // A history that fills the state: a meal, a refusal, water, and prey left in for some.
    const now = Date.now();
    const events = keeper.animalIds.flatMap((animalId, i) =>
      [
        { kind: 'ate', daysAgo: 9 + (i % 7) },
        { kind: 'refused', daysAgo: 2 + (i % 3) },
        { kind: 'watered', daysAgo: 1 + (i % 4) },
        ...(i % 5 === 0 ? [{ kind: 'prey_left_in', daysAgo: 1 }] : []),
      ].map((e) => ({
        id: randomUUID(),
        animalId,
        kind: e.kind,
        payload: e.kind === 'prey_left_in' ? { preyType: 'cricket' } : {},
        clientRecordedAt: new Date(now - e.daysAgo * DAY_MS).toISOString(),
      })),
    );
    for (let i = 0; i < events.length; i += 200) {
      const res = await fetch(`${base}/events`, {
        method: 'POST',
        headers: { ...headers, 'Content-Type': 'application/json' },
        body: JSON.stringify({
          deviceId: 'bench',
          clientSentAt: new Date().toISOString(),
          events: events.slice(i, i + 200),
        }),
      });
      if (!res.ok) throw new Error(`OFF-1k: sync failed with ${res.status}`);
    }
    const res = await fetch(`${base}/rounds/engine-input`, { headers });
    if (!res.ok) throw new Error(`OFF-1k: engine input answered ${res.status}`);
    const json = await res.text();
    const input = engineInputResponse.parse(JSON.parse(json));
    // IndexedDB stores the parsed object (structured clone); its JSON length is a close measure.
    const kib = Buffer.byteLength(json) / 1024;
    const gzipKib = gzipSync(json).length / 1024;
    const times: number[] = [];
    for (let run = 0; run < 7; run++) {
      const t = performance.now();
      phoneRound(input, [], addDays(input.date, 1 + (run % 2)), true);
      times.push(performance.now() - t);
    }
    const buildMs = median(times);
    const figures: Figure[] = [
      {
        id: 'OFF-1k',
        what: `engine input a keeper's phone keeps, ${ANIMALS} animals with a history (JSON)`,
        value: Math.round(kib),
        unit: 'KiB',
        target: 1024,
        pass: kib <= 1024,
      },
      {
        id: 'OFF-1k-wire',
        what: `the same over the wire (gzip); refreshed only when the collection changes (304 otherwise)`,
        value: Math.round(gzipKib),
        unit: 'KiB',
        target: 100,
        pass: gzipKib <= 100,
      },
      {
        id: 'OFF-1k-build',
        what: `a day's round built from it with the shared engine (Node, median of 7; a phone at CPU ×4 takes about 4×)`,
        value: Math.round(buildMs),
        unit: 'ms',
        target: 250,
        pass: buildMs <= 250,
      },
    ];
    return {
      figures,
      notes: [
        `OFF-1k: ${Math.round(kib)} KiB JSON (${Math.round((kib * 1024) / ANIMALS)} bytes an animal), ${Math.round(gzipKib)} KiB gzip; a day built in ${buildMs.toFixed(0)} ms (median of 7).`,
      ],
    };
  } finally {
    await app.close();
  }
}
