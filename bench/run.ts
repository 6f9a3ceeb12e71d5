// Runs the benchmarks named on the command line (all when none) against a fresh database.
import pg from 'pg';
import { connectDatabase } from '../server/db/client';
import { migrateDatabase } from '../server/db/migrate';
import { runOffEngineInput } from './off-engine-input';
import { runP1, runP1k } from './p1-tap-latency';
import { runP2, runP3, runP4 } from './p2-p4-pages';
import { runP2Waterfall, runP3Waterfall } from './p3-waterfall';
import { runP5 } from './p5-sync-flush';
import { runP6 } from './p6-round-build';
import { runP7 } from './p7-load';
import { recordFigures, type Figure } from './results-file';
import { runS6Timing } from './s6-timing';
import { runT1 } from './t1-table';

const BENCHES: Record<
  string,
  (db: ReturnType<typeof connectDatabase>) => Promise<{ figures: Figure[]; notes: string[] }>
> = {
  P1: runP1,
  'P1-1K': runP1k,
  P2: runP2,
  P3: runP3,
  P4: runP4,
  'P2-WATERFALL': runP2Waterfall,
  'P3-WATERFALL': runP3Waterfall,
  P5: runP5,
  P6: runP6,
  P7: runP7,
  T1: runT1,
  'S6-TIMING': runS6Timing,
  'OFF-1K': runOffEngineInput,
};

const url = process.env.BENCH_DATABASE_URL;
if (!url) throw new Error('BENCH_DATABASE_URL is not set: run `npm run bench`.');
const wanted = process.argv.slice(2).map((a) => a.toUpperCase());
const unknown = wanted.filter((id) => !BENCHES[id]);
if (unknown.length) {
  console.error(
    `Unknown benchmark ${unknown.join(', ')}. Known: ${Object.keys(BENCHES).join(', ')}.`,
  );
  process.exit(2);
}

// A fresh database each run, so figures do not depend on what an earlier run left behind.
const name = new URL(url).pathname.slice(1);
const admin = new URL(url);
admin.pathname = '/postgres';
const client = new pg.Client({ connectionString: admin.toString() });
await client.connect();
await client.query(`drop database if exists "${name}" with (force)`);
await client.query(`create database "${name}"`);
await client.end();

const database = connectDatabase(url, 4);
await migrateDatabase(database.db);
const figures: Figure[] = [];
const notes: string[] = [];
try {
  for (const id of wanted.length ? wanted : Object.keys(BENCHES)) {
    console.log(`running ${id}…`);
    const result = await BENCHES[id]!(database);
    figures.push(...result.figures);
    notes.push(...result.notes);
    for (const f of result.figures)
      console.log(
        `${f.pass ? 'pass' : 'FAIL'} ${f.id}: ${f.value} ${f.unit} (target ${f.target}${f.ratio !== undefined ? `, ratio ${f.ratio}` : ''}) — ${f.what}`,
      );
  }
} finally {
  await database.close();
}
recordFigures(figures, `npm run bench${wanted.length ? ` -- ${wanted.join(' ')}` : ''}`, notes);
