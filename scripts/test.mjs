// `npm test`: the same set-up as `npm start` on a separate database, then every check.
import { spawn, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import {
  clusterUrl,
  ensureChromium,
  ensureNodeModules,
  repoRoot,
  say,
  startCluster,
  stopCluster,
} from './lib/setup.mjs';

const began = Date.now();
ensureNodeModules();
ensureChromium();
const startedCluster = process.env.TEST_DATABASE_URL ? false : startCluster();
const env = {
  ...process.env,
  TEST_DATABASE_URL: process.env.TEST_DATABASE_URL ?? clusterUrl('rackside_test'),
  NODE_ENV: 'test',
};
const bin = (name) => path.join(repoRoot, 'node_modules', '.bin', name);
const resultsDir = path.join(repoRoot, 'test-results');
fs.mkdirSync(resultsDir, { recursive: true });
for (const p of ['unit', 'api', 'e2e'])
  fs.rmSync(path.join(resultsDir, `${p}.json`), { force: true });

const vitest = (project) => [
  bin('vitest'),
  [
    'run',
    '--project',
    project,
    '--reporter=default',
    '--reporter=json',
    `--outputFile.json=test-results/${project}.json`,
  ],
];
/** The browser lane's own template database, beside the API tests' one. */
function e2eTemplate(url) {
  const u = new URL(url);
  u.pathname = `${u.pathname}_e2e`;
  return u.toString();
}

// Two lanes side by side: the browser tests mostly wait (on pages, the server, throttled links)
// and the checks and API tests mostly compute, so together they fill two cores where one after
// the other they took about eighteen minutes. Each lane has its own template database.
const checks = [
  ['typecheck', bin('tsc'), ['-p', 'tsconfig.json', '--noEmit']],
  ['lint', bin('eslint'), ['.', '--max-warnings=0']],
  ['format', bin('prettier'), ['--check', '.', '--log-level', 'warn']],
  ['references', process.execPath, ['scripts/check-references.mjs']],
  ['unit', ...vitest('unit')],
  ['api', ...vitest('api')],
];
const browser = [
  // The production build, as users get it (NODE_ENV=test would give React's development build).
  ['build', bin('vite'), ['build', '--logLevel', 'warn'], { NODE_ENV: 'production' }],
  ['e2e', ...vitest('e2e'), { TEST_DATABASE_URL: e2eTemplate(env.TEST_DATABASE_URL) }],
];

// The container recipe (Dockerfile): built only where a container engine answers. Its files
// are checked everywhere by scripts/deploy-recipe.test.ts (in `unit`).
const engine = spawnSync('docker', ['info'], { stdio: 'ignore' }).status === 0;
if (engine) checks.push(['image', 'docker', ['build', '--tag', 'rackside:test', '.']]);

const outcome = [];
/**
 * Runs a lane's stages in order. The browser lane prints as it goes; the other lane's output is
 * kept and printed whole when each stage ends, so the two never interleave line by line.
 */
async function runLane(stages, live) {
  for (const [name, cmd, args, extraEnv] of stages) {
    const t0 = Date.now();
    if (live) say(`── ${name} ──`);
    const child = spawn(cmd, args, {
      cwd: repoRoot,
      env: { ...env, ...extraEnv },
      stdio: live ? 'inherit' : ['ignore', 'pipe', 'pipe'],
    });
    const kept = [];
    child.stdout?.on('data', (d) => kept.push(d));
    child.stderr?.on('data', (d) => kept.push(d));
    const code = await new Promise((resolve) => {
      child.on('error', () => resolve(-1));
      child.on('close', (c) => resolve(c));
    });
    if (!live) {
      say(`── ${name} (${code === 0 ? 'passed' : 'FAILED'}) ──`);
      process.stdout.write(Buffer.concat(kept));
    }
    outcome.push({ name, ok: code === 0, seconds: (Date.now() - t0) / 1000 });
  }
}
await Promise.all([runLane(checks, false), runLane(browser, true)]);
if (startedCluster) stopCluster();

let passed = 0;
let failed = 0;
for (const project of ['unit', 'api', 'e2e']) {
  const file = path.join(resultsDir, `${project}.json`);
  if (!fs.existsSync(file)) continue;
  const report = JSON.parse(fs.readFileSync(file, 'utf8'));
  passed += report.numPassedTests ?? 0;
  failed += report.numFailedTests ?? 0;
}
const order = [...checks, ...browser].map(([name]) => name);
outcome.sort((a, b) => order.indexOf(a.name) - order.indexOf(b.name));
for (const s of outcome)
  say(`${s.ok ? 'ok  ' : 'FAIL'} ${s.name.padEnd(10)} ${s.seconds.toFixed(1)} s`);
if (!engine)
  say(
    "skip image      no container engine here (`docker info` failed): the Dockerfile was not built; scripts/deploy-recipe.test.ts checked the recipe's files.",
  );
say(`whole run ${((Date.now() - began) / 1000).toFixed(0)} s`);
const stagesFailed = outcome.filter((s) => !s.ok).length;
if (stagesFailed) failed = Math.max(failed, 1);
console.log(`tests: ${passed} passed, ${failed} failed`);
process.exit(stagesFailed ? 1 : 0);
