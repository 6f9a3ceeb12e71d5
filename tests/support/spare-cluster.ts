// A throwaway PostgreSQL cluster of its own, for the test that stops and starts PostgreSQL
// under a running server without disturbing the shared test cluster.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { asPostgres, findPostgresBin } from '../../scripts/lib/setup.mjs';
import { freePort } from './server-process';

/** A PostgreSQL tool from Debian's install (setup.mjs finds it); throws when the tool fails. */
function runTool(tool: string, args: string[]) {
  const bin = findPostgresBin();
  if (!bin) throw new Error('PostgreSQL is not installed: run npm test, which installs it.');
  const result = asPostgres(path.join(bin, tool), args);
  if (!result.ok) throw new Error(`${tool} failed: ${result.out}`);
}

export interface SpareCluster {
  url: string;
  stop(): void;
  start(): void;
  destroy(): void;
}

export async function startSpareCluster(): Promise<SpareCluster> {
  const root = fs.mkdtempSync(path.join(os.tmpdir(), 'rackside-pg-'));
  fs.chmodSync(root, 0o755);
  const dataDir = path.join(root, 'data');
  // As root, PostgreSQL runs as `postgres` (setup.mjs), which must own its folder.
  if (process.getuid?.() === 0) spawnSync('chown', ['postgres:postgres', root]);
  const port = await freePort();
  // Trust on loopback only: the cluster lives for one test and listens on 127.0.0.1.
  runTool('initdb', [
    '-D',
    dataDir,
    '-U',
    'rackside',
    '--auth=trust',
    '--encoding=UTF8',
    '--locale=C.UTF-8',
  ]);
  fs.appendFileSync(
    path.join(dataDir, 'postgresql.conf'),
    `\nlisten_addresses = '127.0.0.1'\nport = ${port}\nunix_socket_directories = ''\njit = off\nfsync = off\n`,
  );
  const cluster: SpareCluster = {
    url: `postgres://rackside@127.0.0.1:${port}/rackside`,
    start: () =>
      runTool('pg_ctl', [
        'start',
        '-w',
        '-t',
        '60',
        '-D',
        dataDir,
        '-l',
        path.join(root, 'server.log'),
      ]),
    stop: () => runTool('pg_ctl', ['stop', '-m', 'fast', '-w', '-D', dataDir]),
    destroy: () => {
      try {
        cluster.stop();
      } catch {
        // already stopped
      }
      fs.rmSync(root, { recursive: true, force: true });
    },
  };
  cluster.start();
  const admin = new pg.Client({
    connectionString: `postgres://rackside@127.0.0.1:${port}/postgres`,
  });
  await admin.connect();
  await admin.query('create database rackside');
  await admin.end();
  return cluster;
}
