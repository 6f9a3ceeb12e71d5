// A chore transport with faults between the phone and the server, for the chores' S1 tests
// (chores-exactly-once, room-readings-exactly-once): dropped requests and answers, a server
// error, a batch delivered twice, a proxy's 404 after the server committed.
import type { ChoreTransport } from '../../src/lib/sync';

export const CHORE_FAULTS = [
  'none',
  'drop_request',
  'drop_response',
  'server_error',
  'duplicate',
  'proxy_404_after_commit',
] as const;
export type ChoreFault = (typeof CHORE_FAULTS)[number];

/** `post` delivers one request to the real server; faults are taken in turn, one per batch. */
export function faultyChores(
  post: (path: string, body: unknown) => Promise<Response>,
  faults: readonly ChoreFault[],
): ChoreTransport {
  let n = 0;
  const deliver = async (collection: string, body: unknown) => {
    const res = await post(`/api/collections/${collection}/chores`, body);
    return { status: res.status, body: await res.json().catch(() => null) };
  };
  return async (collection, body) => {
    const fault = faults[n++ % faults.length]!;
    switch (fault) {
      case 'drop_request':
        throw new TypeError('Failed to fetch');
      case 'drop_response':
        await deliver(collection, body);
        throw new TypeError('Failed to fetch');
      case 'server_error':
        return { status: 500, body: { error: { code: 'internal', message: 'Oops.' } } };
      case 'duplicate':
        await deliver(collection, body);
        return deliver(collection, body);
      case 'proxy_404_after_commit':
        await deliver(collection, body);
        return { status: 404, body: null };
      default:
        return deliver(collection, body);
    }
  };
}
