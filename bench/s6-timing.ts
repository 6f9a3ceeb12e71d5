// S6-timing: does the time of an answer tell whether an e-mail has an account? For sign-in
// (wrong password), sign-up, password reset and a keeper invite, the same request is made for
// a known and an unknown address, interleaved in random order, many times; the medians must
// agree within a stated tolerance. The app runs at the production bcrypt cost (11) and sends
// mail through a real SMTP conversation (the loopback fake), as a mail server would be talked to.
import { randomUUID } from 'node:crypto';
import { performance } from 'node:perf_hooks';
import bcrypt from 'bcryptjs';
import type { Database } from '../server/db/client';
import { startDevSmtp } from '../server/mail/dev-smtp';
import { createSmtpMailer } from '../server/mail/mailer';
import { makeKeeper, signInCookie, startBenchApp } from './bench-app';
import { median, type Figure } from './results-file';

/** Pairs of requests per endpoint (one known, one unknown each). */
const PAIRS = 80;
const WARM_UP = 8;
/** The default BCRYPT_COST (server/env.ts), so the decoy's cost is tested where it matters. */
const COST = 11;
/**
 * Background work a request started (the e-mail) must not land in the next request's time:
 * a short pause after each lets it finish, as a person's requests are seconds apart.
 */
const SETTLE_MS = 25;
/**
 * Tolerance: the medians may differ by at most 10 % of the larger or 2 ms, whichever is more —
 * well under the 2× of a cost-10 decoy against cost-11 hashes, or the SMTP conversation
 * (several ms) that reset mail used to add inside the request (common practice for timing
 * side channels on a noisy shared machine, no published source).
 */
const tolerance = (a: number, b: number) => Math.max(2, 0.1 * Math.max(a, b));

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export async function runS6Timing(
  database: Database,
): Promise<{ figures: Figure[]; notes: string[] }> {
  const smtp = await startDevSmtp();
  const mailer = createSmtpMailer(smtp.url, 'Rackside bench <bench@rackside.invalid>');
  const app = await startBenchApp(database, { mailer, bcryptCost: COST });
  try {
    const owner = await makeKeeper(database, 1, 's6-owner');
    // The known account, hashed at the app's cost as a real sign-up would be.
    const knownEmail = `s6-known-${Date.now()}@bench.test`;
    await database.pool.query(
      `insert into users (email, password_hash, display_name) values ($1, $2, 'Known')`,
      [knownEmail, await bcrypt.hash('the right password 1', COST)],
    );
    const cookie = await signInCookie(app.baseUrl, owner.email);
    const post = (path: string, body: unknown, withCookie = false) =>
      fetch(`${app.baseUrl}${path}`, {
        method: 'POST',
        headers: {
          'Content-Type': 'application/json',
          'X-Rackside-Client': '1',
          ...(withCookie ? { Cookie: cookie } : {}),
        },
        body: JSON.stringify(body),
      });
    const unknownEmail = () => `s6-unknown-${randomUUID().slice(0, 12)}@bench.test`;

    const endpoints: {
      name: string;
      expect: number;
      send: (email: string) => Promise<Response>;
    }[] = [
      {
        name: 'sign-in with a wrong password',
        expect: 401,
        send: (email) => post('/api/auth/sign-in', { email, password: 'a wrong password 1' }),
      },
      { name: 'sign-up', expect: 202, send: (email) => post('/api/auth/sign-up', { email }) },
      {
        name: 'password reset request',
        expect: 202,
        send: (email) => post('/api/auth/reset-request', { email }),
      },
      {
        name: 'keeper invite',
        expect: 202,
        send: (email) =>
          post(`/api/collections/${owner.collectionId}/members`, { email, role: 'keeper' }, true),
      },
    ];

    const figures: Figure[] = [];
    const notes: string[] = [];
    for (const endpoint of endpoints) {
      const time = async (email: string) => {
        const t0 = performance.now();
        const res = await endpoint.send(email);
        await res.arrayBuffer();
        const ms = performance.now() - t0;
        if (res.status !== endpoint.expect)
          throw new Error(
            `S6-timing ${endpoint.name} answered ${res.status}, expected ${endpoint.expect}`,
          );
        await sleep(SETTLE_MS);
        return ms;
      };
      for (let i = 0; i < WARM_UP; i++) {
        await time(knownEmail);
        await time(unknownEmail());
      }
      const known: number[] = [];
      const unknown: number[] = [];
      for (let i = 0; i < PAIRS; i++) {
        // Random order within each pair, so drift and warm caches favour neither side.
        if (Math.random() < 0.5) {
          known.push(await time(knownEmail));
          unknown.push(await time(unknownEmail()));
        } else {
          unknown.push(await time(unknownEmail()));
          known.push(await time(knownEmail));
        }
      }
      const k = median(known);
      const u = median(unknown);
      const gap = Math.abs(k - u);
      const allowed = tolerance(k, u);
      figures.push({
        id: 'S6-timing',
        what: `${endpoint.name}: gap between the medians for a known and an unknown e-mail (${PAIRS} pairs, bcrypt cost ${COST})`,
        value: Number(gap.toFixed(2)),
        unit: 'ms',
        target: `≤ ${allowed.toFixed(1)} (10 % or 2 ms)`,
        baseline: Number(k.toFixed(2)),
        ratio: Number((u / k).toFixed(3)),
        pass: gap <= allowed,
      });
      notes.push(
        `S6-timing ${endpoint.name}: median known ${k.toFixed(2)} ms, unknown ${u.toFixed(2)} ms (baseline column = known, ratio = unknown ÷ known).`,
      );
    }
    return { figures, notes };
  } finally {
    await app.close();
    mailer.close();
    await smtp.stop();
  }
}
