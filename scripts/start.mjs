// `npm start`: from a clean clone to a running, seeded app.
import { spawn } from 'node:child_process';
import path from 'node:path';
import { lanEnv } from './lib/lan.mjs';
import { localSessionSecret } from './lib/secrets.mjs';
import { SERVER_NODE_FLAGS } from './lib/server-flags.mjs';
import {
  ensureNodeModules,
  prepareDatabase,
  repoRoot,
  run,
  runTs,
  say,
  stopCluster,
} from './lib/setup.mjs';

const began = Date.now();
ensureNodeModules();

const { databaseUrl, startedCluster } = await prepareDatabase();

const production = process.env.NODE_ENV === 'production';
const env = {
  ...process.env,
  DATABASE_URL: databaseUrl,
  DEMO_MODE: process.env.DEMO_MODE ?? (production ? 'false' : 'true'),
  SESSION_SECRET: process.env.SESSION_SECRET ?? (production ? '' : localSessionSecret()),
};

// `npm start -- --lan`: HTTPS on the home network with a certificate made for this machine.
if (process.argv.includes('--lan')) {
  runTs('scripts/lan-certificate.ts', [], env);
  Object.assign(env, lanEnv(process.env));
}

say('Applying database migrations…');
runTs('server/cli.ts', ['migrate'], env);
if (env.DEMO_MODE === 'true') runTs('server/cli.ts', ['seed', '--if-empty'], env);

say('Building the app…');
run(path.join(repoRoot, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'warn'], { env });
runTs('scripts/build-server.ts', [], env);
say(`Ready to serve after ${((Date.now() - began) / 1000).toFixed(1)} s of set-up.`);

// The bundled server (scripts/build-server.ts), run by node itself.
const server = spawn(
  process.execPath,
  [...SERVER_NODE_FLAGS, path.join(repoRoot, 'dist-server', 'index.mjs')],
  {
    cwd: repoRoot,
    env,
    stdio: 'inherit',
  },
);

let stopping = false;
function shutdown() {
  if (stopping) return;
  stopping = true;
  server.kill('SIGTERM');
}
process.on('SIGINT', shutdown);
process.on('SIGTERM', shutdown);
server.on('exit', (code) => {
  if (startedCluster) {
    say('Stopping the private PostgreSQL cluster…');
    stopCluster();
  }
  process.exit(stopping ? 0 : (code ?? 1));
});
