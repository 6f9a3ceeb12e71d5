// `npm run bench [ID…]`: performance figures against the real database (see bench/run.ts).
import {
  clusterUrl,
  ensureDatabase,
  ensureNodeModules,
  runTs,
  startCluster,
  stopCluster,
} from './lib/setup.mjs';

ensureNodeModules();
const started = process.env.BENCH_DATABASE_URL ? false : startCluster();
const url = process.env.BENCH_DATABASE_URL ?? clusterUrl('rackside_bench');
await ensureDatabase(url);
try {
  runTs('bench/run.ts', process.argv.slice(2), {
    ...process.env,
    BENCH_DATABASE_URL: url,
    NODE_ENV: 'test',
  });
} finally {
  if (started) stopCluster();
}
