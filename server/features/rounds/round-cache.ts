// Today's round, serialised once per change rather than once per request (P7): a phone, or fifty,
// reading an unchanged round get the same bytes. Entries are keyed on the collection's change
// counters (collection_revisions, kept by triggers), read before the round is loaded, so an
// entry is never newer than its key claims and never served after the data changed.
import { createHash } from 'node:crypto';
import { gzipSync } from 'node:zlib';
import type { LocalDate } from '#shared/domain/local-dates';
import { viewItem, type BuiltPart, type ViewInput } from '#shared/domain/rounds/round-view';
import { progressOf, type DayOutcome } from '#shared/domain/rounds/settle';

export interface SerialisedRound {
  etag: string;
  json: Buffer;
  /** gzip of `json`, made the first time a client accepts it. */
  gzip(): Buffer;
}

export function serialiseRound(key: string, json: Buffer | string): SerialisedRound {
  const bytes = typeof json === 'string' ? Buffer.from(json) : json;
  let zipped: Buffer | undefined;
  return {
    etag: `"${createHash('sha1').update(key).digest('base64url').slice(0, 22)}"`,
    json: bytes,
    // Level 1: made once per change of a busy round, and within a few per cent of level 6's size
    // on this repetitive JSON.
    gzip: () => (zipped ??= gzipSync(bytes, { level: 1 })),
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
    while (this.entries.size > this.maxOwners)
      this.entries.delete(this.entries.keys().next().value!);
    return value;
  }
}

const COMMA = Buffer.from(',');

/**
 * The same JSON as `JSON.stringify(roundView(...))`, as bytes, each item's bytes kept while its
 * outcomes (and who recorded them) stand: after a tap only the tapped animals' items are settled
 * and serialised again, and the round is put together by copying bytes, not by joining and
 * encoding 400-odd KB of text again (P7). Items are remembered by identity, so a cached built
 * part keeps them warm.
 */
export function createRoundJson() {
  const itemJson = new WeakMap<
    ViewInput,
    { signature: string; progress: { done: number; total: number }; bytes: Buffer }
  >();
  return (
    zone: string,
    date: LocalDate,
    part: BuiltPart,
    outcomes: Map<string, DayOutcome[]>,
  ): Buffer => {
    const entries = part.items.map((item) => {
      const own = outcomes.get(item.animal.id) ?? [];
      const signature = own.map((o) => `${o.eventId}:${o.by ?? ''}`).join(',');
      let entry = itemJson.get(item);
      if (entry?.signature !== signature) {
        const v = viewItem(zone, item, own);
        entry = { signature, progress: progressOf([v]), bytes: Buffer.from(JSON.stringify(v)) };
        itemJson.set(item, entry);
      }
      return entry;
    });
    const head = { date, timeZone: zone, builtAt: part.builtAt?.toISOString() ?? null };
    const progress = { done: 0, total: 0 };
    for (const e of entries) {
      progress.done += e.progress.done;
      progress.total += e.progress.total;
    }
    const tail = { prepList: part.prepList, progress };
    const parts: Buffer[] = [Buffer.from(`${JSON.stringify(head).slice(0, -1)},"items":[`)];
    entries.forEach((e, i) => {
      if (i) parts.push(COMMA);
      parts.push(e.bytes);
    });
    parts.push(Buffer.from(`],${JSON.stringify(tail).slice(1)}`));
    return Buffer.concat(parts);
  };
}
