import type { EventKind } from '../event-kinds';
import { localDateOf, type LocalDate } from '../local-dates';

/** The facts the engine needs from one event. */
export interface EngineEvent {
  id: string;
  kind: EventKind;
  effectiveAt: string; // ISO instant
  payload?: Record<string, unknown>;
}

/**
 * What the round engine needs to know about one animal, folded from its events. Kept as a
 * projection in the database (updated with each ingested event) so building a round reads
 * O(animals), and rebuilt from the log when events arrive out of order.
 * All dates are local calendar dates in the collection's zone.
 */
export interface AnimalState {
  lastMeal: LocalDate | null;
  /** Consecutive refusals since the last meal, molt or keeper's clearing. */
  refusalStreak: number;
  lastRefusal: LocalDate | null;
  lastMolt: LocalDate | null;
  /** Premolt seen by the keeper (R4), until a molt, a meal or premolt-cleared. */
  premoltSince: LocalDate | null;
  /** Molting now / guarding a sac or a brood (R11), until the next outcome. */
  leaveAlone: { reason: 'molting' | 'guarding_sac' | 'guarding_brood'; since: LocalDate } | null;
  preyLeftIn: { since: LocalDate; preyType: string | null } | null;
  lastWatered: LocalDate | null;
  /** R8: fed more often from this date (for as long as the rules say). */
  rebuildSince: LocalDate | null;
  rebuildReason: 'sac_pulled' | 'sac_hatched' | 'brood_dispersed' | 'paired' | 'keeper' | null;
  /** The last time the keeper looked at the animal without feeding it (check tasks). */
  lastObserved: LocalDate | null;
  lastSkipped: LocalDate | null;
  /**
   * R16: rehoused into a new enclosure on this day (a move with `rehoused`), until a meal.
   * Projections stored before this field existed lack it: read it as `?? null`.
   */
  rehousedOn: LocalDate | null;
  /**
   * Enclosure care (docs/care-rules.md § Enclosure care): the last misting, substrate
   * moistening, spot-clean and rehouse. Projections stored before these fields lack them: read
   * them as `?? null`.
   */
  lastMisted?: LocalDate | null;
  lastMoistened?: LocalDate | null;
  lastSpotCleaned?: LocalDate | null;
  lastRehoused?: LocalDate | null;
  /** Instant of the latest event folded in, to tell whether a new event is in order. */
  lastEventAt: string | null;
  lastEventId: string | null;
}

export const EMPTY_STATE: AnimalState = {
  lastMeal: null,
  refusalStreak: 0,
  lastRefusal: null,
  lastMolt: null,
  premoltSince: null,
  leaveAlone: null,
  preyLeftIn: null,
  lastWatered: null,
  rebuildSince: null,
  rebuildReason: null,
  lastObserved: null,
  lastSkipped: null,
  rehousedOn: null,
  lastMisted: null,
  lastMoistened: null,
  lastSpotCleaned: null,
  lastRehoused: null,
  lastEventAt: null,
  lastEventId: null,
};

/** Events that end a leave-alone period ("until the next outcome", R11). */
const ENDS_LEAVE_ALONE: ReadonlySet<EventKind> = new Set([
  'ate',
  'refused',
  'molted',
  'sac_pulled',
  'sac_hatched',
  'brood_dispersed',
  'premolt_cleared',
]);

/** Events in the order the engine folds them: by effective instant, then id (stable). */
export function compareEvents(a: EngineEvent, b: EngineEvent): number {
  return a.effectiveAt < b.effectiveAt
    ? -1
    : a.effectiveAt > b.effectiveAt
      ? 1
      : a.id < b.id
        ? -1
        : a.id > b.id
          ? 1
          : 0;
}

/** True when `event` comes after everything already folded into `state`. */
export function isInOrder(state: AnimalState, event: EngineEvent): boolean {
  if (!state.lastEventAt) return true;
  return (
    compareEvents(
      { id: state.lastEventId ?? '', kind: 'note', effectiveAt: state.lastEventAt },
      event,
    ) < 0
  );
}

/** Folds one event into the state (a pure function: returns a new state). */
export function applyEvent(state: AnimalState, event: EngineEvent, zone: string): AnimalState {
  const day = localDateOf(new Date(event.effectiveAt), zone);
  const s: AnimalState = { ...state, lastEventAt: event.effectiveAt, lastEventId: event.id };
  if (s.leaveAlone && ENDS_LEAVE_ALONE.has(event.kind)) s.leaveAlone = null;
  const payload = event.payload ?? {};
  switch (event.kind) {
    case 'ate':
      s.lastMeal = day;
      s.refusalStreak = 0;
      s.premoltSince = null;
      s.preyLeftIn = null; // it ate what was offered
      s.rehousedOn = null; // eating: settled in (R16)
      break;
    case 'refused':
      s.refusalStreak += 1;
      s.lastRefusal = day;
      break;
    case 'prey_left_in':
      // Offered and not taken yet. If it is later found eaten the keeper records "ate".
      s.preyLeftIn = {
        since: day,
        preyType: typeof payload.preyType === 'string' ? payload.preyType : null,
      };
      break;
    case 'prey_removed':
      // Prey taken out uneaten is a refusal of that offer.
      if (s.preyLeftIn) {
        s.refusalStreak += 1;
        s.lastRefusal = day;
      }
      s.preyLeftIn = null;
      break;
    case 'watered':
      s.lastWatered = day;
      break;
    case 'misted':
      s.lastMisted = day;
      break;
    case 'substrate_moistened':
      s.lastMoistened = day;
      break;
    case 'spot_cleaned':
      s.lastSpotCleaned = day;
      break;
    case 'rehoused':
      // A new enclosure is a clean one, and a move the animal settles in from (R16).
      s.lastRehoused = day;
      s.lastSpotCleaned = day;
      s.rehousedOn = day;
      break;
    case 'molted':
      s.lastMolt = day;
      s.refusalStreak = 0;
      s.premoltSince = null;
      break;
    case 'premolt_seen':
      s.premoltSince = s.premoltSince ?? day;
      s.lastObserved = day;
      break;
    case 'premolt_cleared':
      s.premoltSince = null;
      s.refusalStreak = 0;
      s.lastObserved = day;
      break;
    case 'molting_now':
      s.leaveAlone = { reason: 'molting', since: day };
      break;
    case 'sac_laid':
      s.leaveAlone = { reason: 'guarding_sac', since: day };
      break;
    case 'sac_pulled':
    case 'sac_hatched':
    case 'brood_dispersed':
      // R8: her rebuild starts when she stops guarding — pulled, hatched with her, or dispersed.
      s.rebuildSince = day;
      s.rebuildReason = event.kind;
      break;
    case 'brood_started':
      s.leaveAlone = { reason: 'guarding_brood', since: day };
      break;
    case 'case_laid':
      // Common practice, no published source: a mantis does not guard her ootheca.
      break;
    case 'paired':
      // Common practice, no published source: a paired female is fed up for the sac to come.
      s.rebuildSince = day;
      s.rebuildReason = 'paired';
      break;
    case 'rebuild_started':
      s.rebuildSince = day;
      s.rebuildReason = 'keeper';
      break;
    case 'rebuild_ended':
      s.rebuildSince = null;
      s.rebuildReason = null;
      break;
    case 'skipped':
      s.lastSkipped = day;
      break;
    case 'note':
      s.lastObserved = day;
      break;
    case 'molt_details':
    case 'moved':
      // A new enclosure, not just a new place on the rack, starts a settling period (R16).
      if (payload.rehoused === true) s.rehousedOn = day;
      break;
    case 'status_changed':
    case 'void':
      break;
  }
  return s;
}

/**
 * The state after all of an animal's events, whatever order they arrived in: events are
 * sorted by effective time, and events cancelled by a `void` are left out.
 * `before`, when given, folds only events whose local date is earlier (a round's view).
 */
export function projectState(
  events: readonly EngineEvent[],
  zone: string,
  before?: LocalDate,
): AnimalState {
  const voided = new Set(
    events
      .filter((e) => e.kind === 'void' && typeof e.payload?.targetId === 'string')
      .map((e) => e.payload!.targetId as string),
  );
  const live = events
    .filter((e) => e.kind !== 'void' && !voided.has(e.id))
    .filter((e) => !before || localDateOf(new Date(e.effectiveAt), zone) < before)
    .sort(compareEvents);
  let state = EMPTY_STATE;
  for (const event of live) state = applyEvent(state, event, zone);
  return state;
}
