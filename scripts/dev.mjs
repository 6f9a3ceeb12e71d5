// `npm run dev`: Vite with hot reload for the client, the API in watch mode behind its proxy.
import { spawn } from 'node:child_process';
import path from 'node:path';
import { localSessionSecret } from './lib/secrets.mjs';
import { ensureNodeModules, prepareDatabase, repoRoot, runTs } from './lib/setup.mjs';

ensureNodeModules();
const { databaseUrl } = await prepareDatabase();
const env = {
  ...process.env,
  DATABASE_URL: databaseUrl,
  DEMO_MODE: process.env.DEMO_MODE ?? 'true',
  SESSION_SECRET: process.env.SESSION_SECRET ?? localSessionSecret(),
  PORT: process.env.API_PORT ?? '3001',
  PUBLIC_URL: process.env.PUBLIC_URL ?? 'http://localhost:5173',
};
runTs('server/cli.ts', ['migrate'], env);
runTs('server/cli.ts', ['seed', '--if-empty'], env);

const bin = (name) => path.join(repoRoot, 'node_modules', '.bin', name);
// Detached groups so Ctrl-C takes every child with it (vite leaves children otherwise).
const children = [
  spawn(bin('tsx'), ['watch', 'server/index.ts'], {
    cwd: repoRoot,
    env,
    stdio: 'inherit',
    detached: true,
  }),
  spawn(bin('vite'), [], { cwd: repoRoot, env, stdio: 'inherit', detached: true }),
];
const stop = () => {
  for (const child of children) {
    try {
      process.kill(-child.pid, 'SIGTERM');
    } catch {
      /* already gone */
    }
  }
  process.exit(0);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
