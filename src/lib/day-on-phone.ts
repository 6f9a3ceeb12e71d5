// Days without signal (decision 015): when the collection's local date turns and the server's
// round cannot be fetched, the phone builds the day itself with the shared round engine from
// the engine input it keeps, plus the taps it has queued since.
import { addDays, localDateOf } from '#shared/domain/local-dates';
import type { EngineInputResponse } from '#shared/schemas/rounds';
import type { CachedRound, RacksideDb, RoundDay, StoredEngineInput } from './db';
import { waitingTaps } from './outbox';
import { cachedRound, storePhoneRound } from './round-cache';

const inputKey = (userId: string, collectionId: string) => `${userId}|${collectionId}`;

export const storedEngineInput = (
  db: RacksideDb,
  userId: string,
  collectionId: string,
): Promise<StoredEngineInput | undefined> => db.get('engineInputs', inputKey(userId, collectionId));

export async function storeEngineInput(
  db: RacksideDb,
  userId: string,
  input: EngineInputResponse,
  etag: string | null,
  fetchedAt: Date,
): Promise<void> {
  await db.put('engineInputs', {
    key: inputKey(userId, input.collectionId),
    userId,
    collectionId: input.collectionId,
    input,
    etag,
    fetchedAt: fetchedAt.toISOString(),
  });
}

/**
 * The round for `day` as the phone should show it at `now`: the stored copy while it is for
 * the right date; otherwise, when the phone holds engine input from an earlier day, that date's
 * round built here (and stored, so taps land on it as on a server round). Without such input
 * (a helper, or a phone that never synced) the old copy is returned, and the screen says
 * plainly which day it is for.
 */
export async function currentRound(
  db: RacksideDb,
  userId: string,
  collectionId: string,
  day: RoundDay,
  now: Date,
): Promise<CachedRound | undefined> {
  const wantedIn = (zone: string) => addDays(localDateOf(now, zone), day === 'tomorrow' ? 1 : 0);
  const cached = await cachedRound(db, userId, collectionId, day);
  // The usual case, and the first screen's: the stored round is the day's. The engine's input
  // (most of a megabyte for a large collection) is read only when a day must be built.
  if (cached && cached.round.date >= wantedIn(cached.round.timeZone)) return cached;
  const engine = await storedEngineInput(db, userId, collectionId);
  const zone = cached?.round.timeZone ?? engine?.input.timeZone;
  if (!zone) return cached;
  const wanted = wantedIn(zone);
  // The input holds the state at the end of its own day at the earliest: it can build the
  // days after it, not the day it was sent on (that day's round comes from the server).
  if (!engine || engine.input.date >= wanted) return cached;
  const taps = (await waitingTaps(db, userId))
    .filter((e) => e.collectionId === collectionId)
    .map((e) => ({ event: e.event, byName: e.byName }));
  // The engine loads here, the first time a day is built on this phone: not with the first screen.
  const { phoneRound } = await import('#shared/domain/rounds/phone-round');
  const round = phoneRound(engine.input, taps, wanted, day === 'today');
  return storePhoneRound(db, userId, collectionId, day, round, engine.input.asOf);
}
