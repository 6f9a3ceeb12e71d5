import type { EventKind } from './event-kinds';
import { localDateOf } from './local-dates';

/**
 * One tap undoes a fact from today (the collection's calendar day); an older one asks first.
 * Today is when slips happen and are noticed — on the round, or looking back over it that
 * evening. By the next day the round has been rebuilt from that fact (due dates, holds,
 * refusal streaks), so undoing it quietly changes a plan someone may already be following,
 * and a stray tap while scrolling a long timeline becomes the likelier cause.
 * (Our own choice; common practice in apps that keep a history, no published source.)
 * A fact entered today for an earlier date (a molt written up late) counts by its own date.
 */
export function undoNeedsConfirmation(at: string, now: Date, zone: string): boolean {
  return localDateOf(new Date(at), zone) !== localDateOf(now, zone);
}

const BREEDING =
  'The breeding record goes, and the female’s guarding and rebuild are worked out again from what remains.';

/** What undoing a fact changes, in the words the confirmation shows. */
export const UNDO_EFFECTS: Record<Exclude<EventKind, 'void'>, string> = {
  ate: 'The meal no longer counts: the next feed is worked out from the meal before it, so it may come due sooner.',
  refused:
    'The refusal no longer counts: the run of refusals (and any premolt hint from it) drops by one.',
  prey_left_in: 'The prey is no longer marked as left inside.',
  prey_removed: 'The prey shows as still inside until it is removed again.',
  watered: 'The water date goes back to the watering before it.',
  misted: 'The misting date goes back to the one before it: misting may come due again.',
  substrate_moistened: 'The moistening date goes back to the one before it: it may come due again.',
  spot_cleaned: 'The spot-clean no longer counts: it may come due again.',
  rehoused:
    'The rehouse no longer counts: a rehouse may be asked for again; an enclosure size it gave stays on the record.',
  molted:
    'The molt goes from the record: the hold after molting and the time since the last molt are worked out from the molt before it.',
  molt_details: 'The size, sex or note added to the molt goes.',
  premolt_seen: 'The animal is no longer marked in premolt: feeds may come back on the round.',
  premolt_cleared: 'The animal counts as in premolt again: feeds may be held back.',
  molting_now: 'The animal is no longer marked as molting: feeds may come back on the round.',
  sac_laid: BREEDING,
  sac_pulled: BREEDING,
  sac_hatched: BREEDING,
  case_laid: BREEDING,
  brood_started: BREEDING,
  brood_dispersed: BREEDING,
  paired: BREEDING,
  rebuild_started: BREEDING,
  rebuild_ended: BREEDING,
  skipped: 'The skip no longer counts: the task may be due again.',
  note: 'The note is crossed out.',
  moved: 'The move is crossed out of the history; the animal stays where it is now.',
  status_changed: 'The status change is crossed out of the history.',
};
