// `npm test`: the same set-up as `npm start` on a separate database, then every check.
import { spawnSync } from 'node:child_process';
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
const stages = [
  ['typecheck', bin('tsc'), ['-p', 'tsconfig.json', '--noEmit']],
  ['lint', bin('eslint'), ['.', '--max-warnings=0']],
  ['format', bin('prettier'), ['--check', '.', '--log-level', 'warn']],
  ['references', process.execPath, ['scripts/check-references.mjs']],
  ['unit', ...vitest('unit')],
  ['api', ...vitest('api')],
  // The production build, as users get it (NODE_ENV=test would give React's development build).
  ['build', bin('vite'), ['build', '--logLevel', 'warn'], { NODE_ENV: 'production' }],
  ['e2e', ...vitest('e2e')],
];

// The container recipe (Dockerfile): built only where a container engine answers. Its files
// are checked everywhere by scripts/deploy-recipe.test.ts (in `unit`).
const engine = spawnSync('docker', ['info'], { stdio: 'ignore' }).status === 0;
if (engine) stages.push(['image', 'docker', ['build', '--tag', 'rackside:test', '.']]);

const outcome = [];
for (const [name, cmd, args, extraEnv] of stages) {
  const t0 = Date.now();
  say(`── ${name} ──`);
  const r = spawnSync(cmd, args, { cwd: repoRoot, env: { ...env, ...extraEnv }, stdio: 'inherit' });
  outcome.push({ name, ok: r.status === 0, seconds: (Date.now() - t0) / 1000 });
}
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
