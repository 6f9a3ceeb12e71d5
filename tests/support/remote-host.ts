// Another host on a private link, for tests of what a client that is not this machine may do:
// a network namespace joined to this one by a veth pair with addresses of its own (10.231.n.1
// here, 10.231.n.2 there). Needs `ip` (iproute2), curl and root, as CI has; a normal account
// runs `ip` through `sudo -n` (password-free sudo). Nothing else on the machine's network is
// touched, and close() removes the namespace and with it the pair.
import { execFile, execFileSync } from 'node:child_process';
import { promisify } from 'node:util';

const run = promisify(execFile);

export interface RemoteResponse {
  status: number;
  setCookie: string[];
  body: unknown;
}

export interface RemoteHost {
  /** This machine's end of the link: bind a server here to be reached from the other host. */
  hostAddress: string;
  /** The other host's address, as this machine sees its requests arrive. */
  remoteAddress: string;
  /** An HTTP request made from inside the other host (curl in the namespace). */
  fetch(
    url: string,
    init?: { method?: string; headers?: Record<string, string>; body?: unknown },
  ): Promise<RemoteResponse>;
  close(): void;
}

// Root runs `ip` itself; anyone else through password-free sudo (`-n`: fail, never prompt).
const asRoot = (args: string[]): [string, string[]] =>
  process.getuid?.() === 0 ? ['ip', args] : ['sudo', ['-n', 'ip', ...args]];
const ip = (...args: string[]) =>
  execFileSync(...asRoot(args), { stdio: ['ignore', 'pipe', 'pipe'] }).toString();

export function createRemoteHost(): RemoteHost {
  const id = process.pid % 100_000;
  const ns = `rackside-${id}`;
  const hostSide = `rsh${id}`;
  const nsSide = `rsn${id}`;
  // A /30 in 10.231.0.0/16 that no interface here uses yet.
  const used = ip('-4', '-o', 'addr', 'show');
  let subnet = (id % 250) + 1;
  while (used.includes(`10.231.${subnet}.`)) subnet = (subnet % 250) + 1;
  const hostAddress = `10.231.${subnet}.1`;
  const remoteAddress = `10.231.${subnet}.2`;

  const close = () => {
    // Deleting the namespace deletes its end of the pair, and so the pair.
    try {
      ip('netns', 'del', ns);
    } catch {
      // not there (set-up failed before creating it)
    }
    try {
      ip('link', 'del', hostSide);
    } catch {
      // gone with the namespace
    }
  };
  close(); // leftovers of an earlier run of this process id
  try {
    ip('netns', 'add', ns);
    ip('link', 'add', hostSide, 'type', 'veth', 'peer', 'name', nsSide);
    ip('link', 'set', nsSide, 'netns', ns);
    ip('addr', 'add', `${hostAddress}/30`, 'dev', hostSide);
    ip('link', 'set', hostSide, 'up');
    ip('netns', 'exec', ns, 'ip', 'addr', 'add', `${remoteAddress}/30`, 'dev', nsSide);
    ip('netns', 'exec', ns, 'ip', 'link', 'set', nsSide, 'up');
    ip('netns', 'exec', ns, 'ip', 'link', 'set', 'lo', 'up');
  } catch (err) {
    close();
    throw new Error(
      `Could not create the test's network namespace (needs iproute2, and root or password-free sudo): ${(err as { stderr?: Buffer }).stderr?.toString() ?? err}`,
    );
  }

  return {
    hostAddress,
    remoteAddress,
    async fetch(url, init = {}) {
      const args = ['-sS', '-D', '-', '-X', init.method ?? 'GET'];
      for (const [name, value] of Object.entries(init.headers ?? {}))
        args.push('-H', `${name}: ${value}`);
      if (init.body !== undefined) args.push('--data-binary', JSON.stringify(init.body));
      // Asynchronous: the server answering may live in this very process.
      const { stdout } = await run(...asRoot(['netns', 'exec', ns, 'curl', ...args, url]), {
        timeout: 20_000,
      });
      // The response head (RFC 9112, 2.1: lines end in CRLF, an empty line ends it), then the body.
      const split = stdout.indexOf('\r\n\r\n');
      const head = stdout.slice(0, split).split('\r\n');
      const text = stdout.slice(split + 4);
      let body: unknown = text;
      try {
        body = JSON.parse(text);
      } catch {
        // not JSON
      }
      return {
        status: Number(head[0]!.split(' ')[1]),
        setCookie: head
          .filter((l) => /^set-cookie:/i.test(l))
          .map((l) => l.slice(l.indexOf(':') + 1).trim()),
        body,
      };
    },
    close,
  };
}
