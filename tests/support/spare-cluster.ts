// A throwaway PostgreSQL cluster of its own, for the test that stops and starts PostgreSQL
// under a running server without disturbing the shared test cluster.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { freePort } from './server-process';

const isRoot = process.getuid?.() === 0;

function postgresBin(): string {
  const onPath = spawnSync('sh', ['-c', 'command -v pg_ctl'], { encoding: 'utf8' }).stdout.trim();
  if (onPath) return path.dirname(onPath);
  const base = '/usr/lib/postgresql';
  const version = fs.readdirSync(base).sort((a, b) => Number(b) - Number(a))[0];
  return path.join(base, version!, 'bin');
}

/** As root, PostgreSQL refuses to run: its tools run as the `postgres` user. */
function asPostgres(tool: string, args: string[]) {
  const cmd = path.join(postgresBin(), tool);
  const [file, argv] = isRoot ? ['runuser', ['-u', 'postgres', '--', cmd, ...args]] : [cmd, args];
  const result = spawnSync(file, argv, { encoding: 'utf8', cwd: '/' });
  if (result.status !== 0) throw new Error(`${tool} failed: ${result.stdout}${result.stderr}`);
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
  if (isRoot) spawnSync('chown', ['postgres:postgres', root]);
  const port = await freePort();
  // Trust on loopback only: the cluster lives for one test and listens on 127.0.0.1.
  asPostgres('initdb', ['-D', dataDir, '-U', 'rackside', '--auth=trust', '--encoding=UTF8', '--locale=C.UTF-8']);
  fs.appendFileSync(path.join(dataDir, 'postgresql.conf'), `\nlisten_addresses = '127.0.0.1'\nport = ${port}\nunix_socket_directories = ''\njit = off\nfsync = off\n`);
  const cluster: SpareCluster = {
    url: `postgres://rackside@127.0.0.1:${port}/rackside`,
    start: () => asPostgres('pg_ctl', ['start', '-w', '-t', '60', '-D', dataDir, '-l', path.join(root, 'server.log')]),
    stop: () => asPostgres('pg_ctl', ['stop', '-m', 'fast', '-w', '-D', dataDir]),
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
  const admin = new pg.Client({ connectionString: `postgres://rackside@127.0.0.1:${port}/postgres` });
  await admin.connect();
  await admin.query('create database rackside');
  await admin.end();
  return cluster;
}
