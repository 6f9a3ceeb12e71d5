// A real Rackside server in its own process (tsx server/index.ts), as production runs it: for
// the tests that kill it, restart PostgreSQL under it, or run two of it side by side.
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import https from 'node:https';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { buildServer } from '../../scripts/build-server';
import { SERVER_NODE_FLAGS } from '../../scripts/lib/server-flags.mjs';
import { startDevSmtp } from '../../server/mail/dev-smtp';
import { repoRoot } from '../../server/repo-root';

const root = repoRoot();

/**
 * A production SESSION_SECRET as an operator makes one (`openssl rand -hex 32`): production
 * refuses example values (server/env.ts). One per test process, so the processes a test
 * starts side by side share it.
 */
export const PRODUCTION_SESSION_SECRET = randomBytes(32).toString('hex');

// Built from the current source once per test process (about 0.1 s), in a folder of its own:
// test files run in parallel processes.
let bundled: Promise<string> | undefined;
/** The production bundle (dist-server/…/index.mjs) built from the current source. */
export const bundleOnce = () => {
  if (!bundled) {
    const parent = path.join(root, 'dist-server');
    // Test workers end without an exit hook running: sweep the folders of finished ones.
    for (const old of fs.existsSync(parent)
      ? fs.readdirSync(parent).filter((d) => d.startsWith('test-'))
      : []) {
      if (!isRunning(Number(old.slice(5))))
        fs.rmSync(path.join(parent, old), { recursive: true, force: true });
    }
    bundled = buildServer(path.join(parent, `test-${process.pid}`, 'index.mjs'));
  }
  return bundled;
};

function isRunning(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

/** A 2xx over HTTPS with `ca` trusted (fetch here cannot be given a CA). */
function httpsOk(url: string, ca: string): Promise<boolean> {
  return new Promise((resolve, reject) => {
    https
      .get(url, { ca }, (res) => {
        res.resume();
        resolve((res.statusCode ?? 500) < 300);
      })
      .on('error', reject);
  });
}

export interface ServerProcess {
  url: string;
  port: number;
  child: ChildProcess;
  /** Every line the process wrote (pino JSON lines in production). */
  lines: string[];
  /** Structured log records (the JSON lines). */
  records(): Record<string, unknown>[];
  kill(signal?: NodeJS.Signals): Promise<void>;
}

export async function startServerProcess(options: {
  databaseUrl: string;
  port?: number;
  env?: Record<string, string>;
  /** Drop stdout (a load test's request logs). */ quiet?: boolean;
  /** e.g. --cpu-prof */ nodeArgs?: string[];
  /** The server answers HTTPS (HTTPS_CERT_FILE in env), trusted through this CA certificate. */
  https?: { ca: string };
}): Promise<ServerProcess> {
  const port = options.port ?? (await freePort());
  const storage = fs.mkdtempSync(path.join(os.tmpdir(), 'rackside-proc-'));
  // The production bundle, run by node itself, so a signal reaches the server directly.
  const bundle = await bundleOnce();
  // Production needs a mail server (server/env.ts): a loopback SMTP sink in this process, unless
  // the caller gives SMTP_URL (an empty one means none).
  const smtp = options.env && 'SMTP_URL' in options.env ? undefined : await startDevSmtp();
  const child = spawn(
    process.execPath,
    [...(options.nodeArgs ?? []), ...SERVER_NODE_FLAGS, bundle],
    {
      cwd: root,
      env: {
        PATH: process.env.PATH ?? '',
        NODE_ENV: 'production',
        HOST: '127.0.0.1',
        PORT: String(port),
        DATABASE_URL: options.databaseUrl,
        SESSION_SECRET: PRODUCTION_SESSION_SECRET,
        BCRYPT_COST: '10',
        STORAGE_DIR: storage,
        LOG_LEVEL: 'info',
        PUBLIC_URL: `http://127.0.0.1:${port}`,
        ...(smtp ? { SMTP_URL: smtp.url } : {}),
        ...options.env,
      },
      stdio: ['ignore', options.quiet ? 'ignore' : 'pipe', 'pipe'],
    },
  );
  const lines: string[] = [];
  const collect = (chunk: Buffer) => lines.push(...chunk.toString().split('\n').filter(Boolean));
  child.stdout?.on('data', collect);
  child.stderr!.on('data', collect);
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  void exited.then(() => smtp?.stop());
  const url = `${options.https ? 'https' : 'http'}://127.0.0.1:${port}`;
  const deadline = Date.now() + 30_000;
  for (;;) {
    if (child.exitCode !== null)
      throw new Error(`server exited (${child.exitCode}):\n${lines.join('\n')}`);
    try {
      if (
        options.https
          ? await httpsOk(`${url}/api/health`, options.https.ca)
          : (await fetch(`${url}/api/health`)).ok
      )
        break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error(`server did not start:\n${lines.join('\n')}`);
    await new Promise((r) => setTimeout(r, 100));
  }
  return {
    url,
    port,
    child,
    lines,
    records: () =>
      lines.flatMap((l) => {
        try {
          return [JSON.parse(l) as Record<string, unknown>];
        } catch {
          return [];
        }
      }),
    async kill(signal = 'SIGTERM') {
      if (child.exitCode === null && child.signalCode === null) child.kill(signal);
      await exited;
      fs.rmSync(storage, { recursive: true, force: true });
    },
  };
}
