// Today's round, serialised once per change rather than once per request (P7): a phone, or fifty,
// reading an unchanged round get the same bytes. Entries are keyed on the collection's change
// counters (collection_revisions, kept by triggers), read before the round is loaded, so an
// entry is never newer than its key claims and never served after the data changed.
import { createHash } from 'node:crypto';
import { gzipSync } from 'node:zlib';

export interface SerialisedRound {
  etag: string;
  json: Buffer;
  /** gzip of `json`, made the first time a client accepts it. */
  gzip(): Buffer;
}

export function serialiseRound(key: string, jsonText: string): SerialisedRound {
  const json = Buffer.from(jsonText);
  let zipped: Buffer | undefined;
  return {
    etag: `"${createHash('sha1').update(key).digest('base64url').slice(0, 22)}"`,
    json,
    // Level 1: made once per change of a busy round, and within a few per cent of level 6's size
    // on this repetitive JSON.
    gzip: () => (zipped ??= gzipSync(json, { level: 1 })),
  };
}

/**
 * One value per owner (a collection), remembered under a key: a different key replaces it.
 * Callers asking for the same key while it is being made share the one promise.
 */
export class LatestByKey<T> {
  private readonly entries = new Map<string, { key: string; value: Promise<T> }>();

  constructor(private readonly maxOwners: number) {}

  get(owner: string, key: string, make: () => Promise<T>): Promise<T> {
    const hit = this.entries.get(owner);
    if (hit?.key === key) return hit.value;
    const value = make();
    this.entries.delete(owner);
    this.entries.set(owner, { key, value });
    // A failed make is not remembered.
    value.catch(() => {
      if (this.entries.get(owner)?.value === value) this.entries.delete(owner);
    });
    // Oldest owners leave first once there are too many (Map keeps insertion order).
    while (this.entries.size > this.maxOwners) this.entries.delete(this.entries.keys().next().value!);
    return value;
  }
}
