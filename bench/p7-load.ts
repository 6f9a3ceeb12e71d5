// P7: the production server (its own process, as `npm start` runs it) on loopback, driven by
// autocannon: 50 connections reading today's round of a 500-animal collection for 20 s while
// 20 devices sync batches of taps. Latency percentiles and errors come from autocannon, the
// server's resident memory from /proc, and lost or doubled events are counted in PostgreSQL.
import { fork } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import autocannon from 'autocannon';
import type { Database } from '../server/db/client';
import {
  freePort,
  PRODUCTION_SESSION_SECRET,
  startServerProcess,
} from '../tests/support/server-process';
import { makeKeeper, signInCookie } from './bench-app';
import type { Figure } from './results-file';

/** The secret startServerProcess gives the server: the baseline checks the same cookie. */
const SERVER_SESSION_SECRET = PRODUCTION_SESSION_SECRET;

/**
 * P7-base (bench/p7-base-server.mjs) in its own process: a bare node:http server that checks
 * the session in PostgreSQL and answers with `gzipped`, read by the same load generator.
 */
async function runBaseline(databaseUrl: string, gzipped: Buffer, headers: Record<string, string>) {
  const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'p7-base-')), 'round.json.gz');
  fs.writeFileSync(file, gzipped);
  const port = await freePort();
  const child = fork(path.join(import.meta.dirname, 'p7-base-server.mjs'), [], {
    env: {
      PATH: process.env.PATH ?? '',
      DATABASE_URL: databaseUrl,
      SESSION_SECRET: SERVER_SESSION_SECRET,
      ROUND_GZIP_FILE: file,
      PORT: String(port),
    },
    execArgv: [],
    stdio: 'ignore',
  });
  try {
    await new Promise<void>((resolve, reject) => {
      child.once('message', () => resolve());
      child.once('exit', (code) => reject(new Error(`P7-base server exited (${code})`)));
    });
    const url = `http://127.0.0.1:${port}/`;
    // Signed out is refused: the baseline really checks the session.
    const anonymous = await fetch(url);
    const signedIn = await fetch(url, { headers });
    if (anonymous.status !== 401 || signedIn.status !== 200)
      throw new Error(`P7-base answered ${anonymous.status} / ${signedIn.status}`);
    return await autocannon({
      url,
      connections: CONNECTIONS,
      duration: DURATION_S,
      headers: { ...headers, 'Accept-Encoding': 'gzip' },
    });
  } finally {
    const exited = new Promise((r) => child.once('exit', r));
    child.kill('SIGTERM');
    await exited;
    fs.rmSync(path.dirname(file), { recursive: true, force: true });
  }
}

const CONNECTIONS = 50;
const DURATION_S = 20;
const DEVICES = 20;
const BATCH = 10;
const ANIMALS = 500;

/** CPU seconds a process has used (user + system), from /proc/<pid>/stat (proc(5), fields 14–15). */
function cpuSeconds(pid: number | 'self'): number {
  const fields = fs.readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1]!.split(' ');
  return (Number(fields[11]) + Number(fields[12])) / 100; // USER_HZ is 100 on Linux
}

/** Resident set size of a process in MB, from /proc/<pid>/status (Linux proc(5), VmRSS). */
function rssMb(pid: number): number {
  const m = /VmRSS:\s+(\d+) kB/.exec(fs.readFileSync(`/proc/${pid}/status`, 'utf8'));
  return m ? Number(m[1]) / 1024 : 0;
}

export async function runP7(database: Database): Promise<{ figures: Figure[]; notes: string[] }> {
  const url = process.env.BENCH_DATABASE_URL!;
  // P7_CPU_PROF=<folder>: the server writes a V8 CPU profile there (where the time goes).
  const profile = process.env.P7_CPU_PROF;
  const server = await startServerProcess({
    databaseUrl: url,
    quiet: true,
    nodeArgs: profile ? ['--cpu-prof', `--cpu-prof-dir=${path.resolve(profile)}`] : [],
  });
  try {
    const keeper = await makeKeeper(database, ANIMALS, 'p7');
    const cookie = await signInCookie(server.url, keeper.email);
    const headers = {
      Cookie: cookie,
      'X-Rackside-Client': '1',
      'Content-Type': 'application/json',
    };
    const roundUrl = `${server.url}/api/collections/${keeper.collectionId}/rounds/today`;
    const first = await fetch(roundUrl, { headers });
    const round = (await first.json()) as { items: unknown[] };
    if (first.status !== 200 || round.items.length !== ANIMALS)
      throw new Error(
        `P7 set-up: the round has ${round.items.length} items (status ${first.status})`,
      );
    const identity = Buffer.from(
      await fetch(roundUrl, {
        headers: { ...headers, 'Accept-Encoding': 'identity' },
      }).then((r) => r.text()),
    );
    const gzipped = gzipSync(identity, { level: 1 });
    const sizes = [identity.length, gzipped.length];

    // The baseline first, on its own (no phones syncing: the bare cost of a checked read).
    const base = await runBaseline(url, gzipped, headers);

    let peakRss = rssMb(server.child.pid!);
    const cpuBefore = {
      server: cpuSeconds(server.child.pid!),
      bench: cpuSeconds('self'),
      at: Date.now(),
    };
    const sampler = setInterval(() => (peakRss = Math.max(peakRss, rssMb(server.child.pid!))), 200);

    // The syncing phones: each sends a batch, waits for the answer, and sends the next.
    const sent: string[] = [];
    let syncErrors = 0;
    // What each failed batch got back, so a failure can be told from the next (status: message).
    const syncFailures: string[] = [];
    let syncBatches = 0;
    const stopAt = Date.now() + DURATION_S * 1000;
    const devices = Array.from({ length: DEVICES }, async (_, d) => {
      while (Date.now() < stopAt) {
        // A batch a second per phone: far busier than a real round, where taps come seconds apart.
        const next = Date.now() + 1000;
        const events = Array.from({ length: BATCH }, (_, i) => ({
          id: randomUUID(),
          animalId: keeper.animalIds[(d * BATCH + i + syncBatches) % keeper.animalIds.length]!,
          kind: 'watered',
          payload: {},
          clientRecordedAt: new Date().toISOString(),
        }));
        const res = await fetch(`${server.url}/api/collections/${keeper.collectionId}/events`, {
          method: 'POST',
          headers,
          body: JSON.stringify({
            deviceId: `p7-${d}`,
            clientSentAt: new Date().toISOString(),
            events,
          }),
        }).catch(() => null);
        if (res?.status === 200) {
          const { results } = (await res.json()) as { results: { status: string }[] };
          if (results.every((r) => r.status === 'accepted')) sent.push(...events.map((e) => e.id));
          else {
            syncErrors++;
            syncFailures.push(
              `200 with ${results.filter((r) => r.status !== 'accepted').length} not accepted`,
            );
          }
          syncBatches++;
        } else {
          syncErrors++;
          syncFailures.push(
            res
              ? `${res.status}: ${(await res.text().catch(() => '')).slice(0, 160)}`
              : 'no answer',
          );
        }
        await new Promise((r) => setTimeout(r, Math.max(0, next - Date.now())));
      }
    });
    // As the app's fetch does: browsers always offer gzip (the round is ~14× smaller so).
    const reads = await autocannon({
      url: roundUrl,
      connections: CONNECTIONS,
      duration: DURATION_S,
      headers: { ...headers, 'Accept-Encoding': 'gzip' },
    });
    await Promise.all(devices);
    clearInterval(sampler);
    const wall = (Date.now() - cpuBefore.at) / 1000;
    const cpuShare = (pid: number | 'self', before: number) =>
      Math.round(((cpuSeconds(pid) - before) / wall) * 100);
    const serverCpu = cpuShare(server.child.pid!, cpuBefore.server);
    const benchCpu = cpuShare('self', cpuBefore.bench);

    const { rows } = await database.pool.query<{ stored: number; doubled: number }>(
      `select count(distinct id)::int as stored, (count(*) - count(distinct id))::int as doubled from events where id = any($1)`,
      [sent],
    );
    const stored = rows[0]!;
    const readErrors = reads.errors + reads.timeouts + reads.non2xx;
    const baseErrors = base.errors + base.timeouts + base.non2xx;
    const throughputRatio = Number((reads.requests.average / base.requests.average).toFixed(2));
    const p99Ratio = Number((reads.latency.p99 / Math.max(1, base.latency.p99)).toFixed(2));
    const lostOrDoubled = sent.length - stored.stored + stored.doubled;
    const figures: Figure[] = [
      {
        id: 'P7',
        what: `p99 latency, ${CONNECTIONS} connections reading a ${ANIMALS}-animal round for ${DURATION_S} s with ${DEVICES} devices syncing`,
        value: reads.latency.p99,
        unit: 'ms',
        target: '≤ 150',
        pass: reads.latency.p99 <= 150,
      },
      {
        id: 'P7',
        what: 'median latency of those reads (for context)',
        value: reads.latency.p50,
        unit: 'ms',
        target: '—',
        pass: true,
      },
      {
        id: 'P7',
        what: 'read errors (socket errors, timeouts, non-2xx)',
        value: readErrors,
        unit: 'errors',
        target: 0,
        pass: readErrors === 0,
      },
      {
        id: 'P7',
        what: 'sync batches refused or failed meanwhile',
        value: syncErrors,
        unit: 'batches',
        target: 0,
        pass: syncErrors === 0,
      },
      {
        id: 'P7',
        what: `events lost or doubled of ${sent.length} acknowledged (counted in PostgreSQL)`,
        value: lostOrDoubled,
        unit: 'events',
        target: 0,
        pass: lostOrDoubled === 0,
      },
      {
        id: 'P7',
        what: 'server peak resident memory (VmRSS)',
        value: Math.round(peakRss),
        unit: 'MB',
        target: '≤ 250',
        pass: peakRss <= 250,
      },
      {
        id: 'P7',
        what: 'round reads per second, relative to P7-base (ratio = Rackside / base)',
        value: Math.round(reads.requests.average),
        unit: 'req/s',
        target: 'ratio ≥ 0.5',
        baseline: Math.round(base.requests.average),
        ratio: throughputRatio,
        pass: throughputRatio >= 0.5,
      },
      {
        id: 'P7',
        what: 'p99 latency relative to P7-base (ratio = Rackside / base)',
        value: reads.latency.p99,
        unit: 'ms',
        target: 'ratio ≤ 2',
        baseline: base.latency.p99,
        ratio: p99Ratio,
        pass: p99Ratio <= 2,
      },
      {
        id: 'P7-base',
        what: `bare node:http server checking the session in PostgreSQL (one indexed query) and sending the same ${Math.round(gzipped.length / 1024)} KB of gzip, ${CONNECTIONS} connections for ${DURATION_S} s: reads per second`,
        value: Math.round(base.requests.average),
        unit: 'req/s',
        target: '—',
        pass: baseErrors === 0,
      },
      {
        id: 'P7-base',
        what: 'its p99 latency (p50 in the notes)',
        value: base.latency.p99,
        unit: 'ms',
        target: '—',
        pass: baseErrors === 0,
      },
    ];
    const notes = [
      `P7-base: ${base.requests.total} reads (${Math.round(base.requests.average)} req/s), latency p50 ${base.latency.p50} ms, p90 ${base.latency.p90} ms, p99 ${base.latency.p99} ms, max ${base.latency.max} ms, ${baseErrors} errors; run just before Rackside's, reads only.`,
      `P7: ${reads.requests.total} round reads (${Math.round(reads.requests.average)} req/s, ${Math.round(sizes[0]! / 1024)} KB of JSON, ${Math.round(sizes[1]! / 1024)} KB gzipped), latency p50 ${reads.latency.p50} ms, p90 ${reads.latency.p90} ms, p99 ${reads.latency.p99} ms, max ${reads.latency.max} ms; ${syncBatches} sync batches of ${BATCH} (${sent.length} events) from ${DEVICES} devices at the same time, each sending a batch a second; the server logs every API request at info level as in production. CPU over the run: server ${serverCpu} % of one core, the load generator and phones ${benchCpu} %, on a machine with ${os.availableParallelism()} cores shared with PostgreSQL.`,
      ...(syncFailures.length ? [`P7 failed sync batches: ${syncFailures.join('; ')}`] : []),
    ];
    return { figures, notes };
  } finally {
    await server.kill();
  }
}
