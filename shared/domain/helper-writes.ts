import { coverWindowState } from './roles';

/**
 * How long after a cover ends a helper's phone may still deliver the taps made during it.
 * Phones at the rack can be without signal for a day or two (a back room, a weekend away from
 * Wi-Fi), so two days; after that a queue is more likely a replay than a late phone
 * (docs/decisions/011-access-that-ends.md).
 */
export const HELPER_SYNC_GRACE_HOURS = 48;
export const HELPER_SYNC_GRACE_MS = HELPER_SYNC_GRACE_HOURS * 3_600_000;

export type HelperWriteVerdict = 'ok' | 'closed_by_owner' | 'too_late' | 'outside_cover';

export interface HelperCover {
  startsAt: Date | null;
  endsAt: Date | null;
  /** Set when the owner ended the cover early: no grace after that. */
  writesClosedAt: Date | null;
}

/**
 * Whether a helper's event may be stored. The server's own clock decides first — the event
 * must arrive before the owner closed the cover and before its end plus the grace — so no
 * setting of the phone's clocks can reopen a cover. Only then is the event's own (corrected)
 * time checked against the cover's days.
 */
export function judgeHelperWrite(
  cover: HelperCover,
  effectiveAt: Date,
  receivedAt: Date,
): HelperWriteVerdict {
  if (cover.writesClosedAt && receivedAt >= cover.writesClosedAt) return 'closed_by_owner';
  if (cover.endsAt && receivedAt.getTime() >= cover.endsAt.getTime() + HELPER_SYNC_GRACE_MS)
    return 'too_late';
  if (coverWindowState(effectiveAt, cover.startsAt, cover.endsAt) !== 'during')
    return 'outside_cover';
  return 'ok';
}
