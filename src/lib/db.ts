import { openDB, type DBSchema, type IDBPDatabase } from 'idb';
import type { AnimalSummary } from '#shared/schemas/animals';
import type { MeResponse } from '#shared/schemas/auth';
import type { RecordedChore } from '#shared/schemas/chores';
import type { ColoniesResponse } from '#shared/schemas/colonies';
import type { RecordedEvent, RejectReason } from '#shared/schemas/events';
import type { EngineInputResponse, RoundResponse } from '#shared/schemas/rounds';

export type RoundDay = 'today' | 'tomorrow';

/** A round as the screen uses it: the server's copy with the phone's unsent taps applied. */
export interface CachedRound {
  key: string;
  userId: string;
  collectionId: string;
  day: RoundDay;
  round: RoundResponse;
  /** When the server's copy was fetched (ISO); for a round built on the phone, its data's time. */
  fetchedAt: string;
  /** Set when the phone built this round itself with no signal (decision 015). */
  builtOnPhone?: boolean;
  /** This phone's taps of the day that the server's round has no place for, shown plainly. */
  unsettled?: UnsettledTap[];
}

/** A tap the phone showed on its own round that the server's round for that day does not hold. */
export interface UnsettledTap {
  eventId: string;
  animalName: string;
  labelCode: string;
  kind: RoundItem['outcomes'][number]['kind'];
  at: string;
}

type RoundItem = RoundResponse['items'][number];

/**
 * How a round is stored: its header in `rounds` and each item as its own record in
 * `roundItems`, so a tap reads and writes one small item, not the whole round (P1 budget).
 */
export interface StoredRound {
  key: string;
  userId: string;
  collectionId: string;
  day: RoundDay;
  /** The round without its items, or its progress: that is counted from the items when read. */
  header: Omit<RoundResponse, 'items' | 'progress'>;
  /** Animal ids in walk order. */
  order: string[];
  fetchedAt: string;
  builtOnPhone?: boolean;
  unsettled?: UnsettledTap[];
}
export interface StoredRoundItem {
  roundKey: string;
  animalId: string;
  /** The collection's zone, for the local times a tap shows ("Ate 08:40"). */
  timeZone: string;
  item: RoundItem;
}

/** A tap waiting to be sent. `seq` keeps the order taps were made in. */
export interface OutboxEntry {
  seq?: number;
  userId: string;
  collectionId: string;
  /** Shown in the indicator and the needs-attention list without another lookup. */
  animalName: string;
  byName: string;
  event: RecordedEvent;
}

/** A tap the server refused: kept and shown until the person sends it again or discards it. */
export interface AttentionEntry {
  id: string;
  userId: string;
  collectionId: string;
  animalName: string;
  /** Who tapped, for the round when the tap is sent again (absent in entries made before). */
  byName?: string;
  event: RecordedEvent;
  /**
   * The server's reason code. `collection_refused` only in entries an earlier version made when
   * a whole batch was answered 403/404; such answers now keep the taps waiting instead.
   */
  reason: RejectReason | 'collection_refused';
  message: string;
  refusedAt: string;
}

/** A collection's animals as last fetched: labels print and scans resolve with no signal. */
export interface StoredDirectory {
  collectionId: string;
  animals: AnimalSummary[];
  fetchedAt: string;
}

/**
 * What the round engine needs, as the server last sent it: the phone builds the next days
 * from it when there is no signal (decision 015). One per person and collection.
 */
export interface StoredEngineInput {
  key: string;
  userId: string;
  collectionId: string;
  input: EngineInputResponse;
  etag: string | null;
  fetchedAt: string;
}

/**
 * A chore (care of something that is not an animal: decision 020) recorded on this phone.
 * `waiting` until the server's verdict; then `sent`, kept a few days so the screen shows it
 * done before the next fetch, or `refused` with the server's words until discarded.
 */
export interface ChoreEntry {
  id: string;
  userId: string;
  collectionId: string;
  /** The local date it was done on, for the day's list. */
  localDate: string;
  state: 'waiting' | 'sent' | 'refused';
  message?: string;
  /** When its verdict came (ISO): sent chores are pruned after a few days. */
  settledAt?: string;
  chore: RecordedChore;
}

/** A collection's feeder colonies as last fetched, so the Colonies section opens offline. */
export interface StoredColonies {
  collectionId: string;
  response: ColoniesResponse;
  fetchedAt: string;
}

export interface RacksideSchema extends DBSchema {
  rounds: { key: string; value: StoredRound };
  roundItems: { key: [string, string]; value: StoredRoundItem; indexes: { byRound: string } };
  outbox: { key: number; value: OutboxEntry; indexes: { byEventId: string; byUser: string } };
  attention: { key: string; value: AttentionEntry; indexes: { byUser: string } };
  directory: { key: string; value: StoredDirectory };
  engineInputs: { key: string; value: StoredEngineInput };
  chores: {
    key: string;
    value: ChoreEntry;
    indexes: { byUserState: [string, string]; byCollectionDate: [string, string] };
  };
  colonies: { key: string; value: StoredColonies };
  /** Small facts: the device id, the last signed-in person, storage persistence. */
  meta: { key: string; value: unknown };
}

export type RacksideDb = IDBPDatabase<RacksideSchema>;
export const DB_NAME = 'rackside';

export function openRacksideDb(name = DB_NAME): Promise<RacksideDb> {
  return openDB<RacksideSchema>(name, 4, {
    // Each version adds to the one before, so a phone with queued taps upgrades without losing them.
    upgrade(db, oldVersion) {
      if (oldVersion < 1) {
        db.createObjectStore('rounds', { keyPath: 'key' });
        db.createObjectStore('roundItems', { keyPath: ['roundKey', 'animalId'] }).createIndex(
          'byRound',
          'roundKey',
        );
        const outbox = db.createObjectStore('outbox', { keyPath: 'seq', autoIncrement: true });
        outbox.createIndex('byEventId', 'event.id', { unique: true });
        outbox.createIndex('byUser', 'userId');
        const attention = db.createObjectStore('attention', { keyPath: 'id' });
        attention.createIndex('byUser', 'userId');
        db.createObjectStore('meta');
      }
      if (oldVersion < 2) db.createObjectStore('directory', { keyPath: 'collectionId' });
      if (oldVersion < 3) db.createObjectStore('engineInputs', { keyPath: 'key' });
      if (oldVersion < 4) {
        const chores = db.createObjectStore('chores', { keyPath: 'id' });
        chores.createIndex('byUserState', ['userId', 'state']);
        chores.createIndex('byCollectionDate', ['collectionId', 'localDate']);
        db.createObjectStore('colonies', { keyPath: 'collectionId' });
      }
    },
  });
}

/**
 * A transaction's completion promise, marked as handled: when one request fails first, the
 * abort that follows must not surface again as an unhandled rejection.
 */
export function transactionDone(tx: { done: Promise<void> }): Promise<void> {
  const done = tx.done;
  done.catch(() => undefined);
  return done;
}

let shared: Promise<RacksideDb> | null = null;

/**
 * The page's one connection. Safari can drop it ("connection lost"): the connection is opened
 * again and the work retried once (architecture notes, known browser traps).
 */
export async function withDb<T>(work: (db: RacksideDb) => Promise<T>): Promise<T> {
  const open = () => {
    shared ??= openRacksideDb().then((db) => {
      db.addEventListener('close', () => (shared = null));
      return db;
    });
    return shared;
  };
  try {
    return await work(await open());
  } catch (err) {
    if (!isConnectionLost(err)) throw err;
    shared = null;
    return work(await open());
  }
}

function isConnectionLost(err: unknown): boolean {
  const e = err as { name?: string; message?: string } | null;
  return (
    e?.name === 'InvalidStateError' ||
    e?.name === 'UnknownError' ||
    /connection (is )?(lost|closing|closed)/i.test(e?.message ?? '')
  );
}

/** The last `me` answer, so the app opens with no signal. */
export const cachedMe = (db: RacksideDb) => db.get('meta', 'me') as Promise<MeResponse | undefined>;
export async function storeMe(db: RacksideDb, me: MeResponse | null): Promise<void> {
  if (me) await db.put('meta', me, 'me');
  else await db.delete('meta', 'me');
}

/** Facts about this browser, not about anyone's collection: they outlive a sign-out. */
const DEVICE_META_KEYS = new Set(['deviceId', 'persistAsked']);

/**
 * At sign-out: forgets every collection the phone cached — rounds and their items, animal
 * lists, the engine's input, the helper's cover copy and the last `me` — so the next person on this phone sees
 * none of it offline. Waiting taps and refused ones stay: they belong to their author, are
 * sent (or shown) at that person's next sign-in, and nobody else can read them in the app.
 */
export async function clearCachedCollections(db: RacksideDb): Promise<void> {
  const tx = db.transaction(
    ['rounds', 'roundItems', 'directory', 'engineInputs', 'colonies', 'meta'],
    'readwrite',
  );
  const meta = tx.objectStore('meta');
  const work: Promise<unknown>[] = [
    tx.objectStore('colonies').clear(),
    tx.objectStore('engineInputs').clear(),
    tx.objectStore('rounds').clear(),
    tx.objectStore('roundItems').clear(),
    tx.objectStore('directory').clear(),
  ];
  for (const key of await meta.getAllKeys())
    if (!DEVICE_META_KEYS.has(String(key))) work.push(meta.delete(key));
  await Promise.all([...work, tx.done]);
}

/** A random id for this browser, made once, sent with every batch. */
export async function deviceIdOf(db: RacksideDb): Promise<string> {
  const known = (await db.get('meta', 'deviceId')) as string | undefined;
  if (known) return known;
  const id = crypto.randomUUID();
  await db.put('meta', id, 'deviceId');
  return id;
}
