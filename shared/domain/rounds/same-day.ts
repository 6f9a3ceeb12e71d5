import type { EventKind } from '../event-kinds';
import { addDays, clockTime, localDateOf } from '../local-dates';
import { shortDate, type Reason, type TaskKind } from './build-round';

/**
 * R18 (docs/care-rules.md, "Same-day holds"): a fact recorded during the day that starts a hold
 * withdraws that day's open tasks it forbids at once, with the reason in their place. Prey
 * removal is never withdrawn: live prey must come out of a molting animal's enclosure (R4).
 */
export interface SameDayHold {
  /** The outcome that started the hold. */
  eventId: string;
  at: string;
  reason: Reason;
  withdraws: ReadonlySet<TaskKind>;
}

interface HoldOutcome {
  eventId: string;
  kind: EventKind;
  at: string;
}

const FEED: ReadonlySet<TaskKind> = new Set(['feed']);
// Molting now: no food, no water, no disturbance (R11); the check is answered by the molt itself.
const EVERYTHING_BUT_PREY: ReadonlySet<TaskKind> = new Set(['feed', 'water', 'check']);

/** Outcomes that start a hold, and the tasks each withdraws. */
export const HOLD_STARTERS: Partial<Record<EventKind, ReadonlySet<TaskKind>>> = {
  molted: FEED,
  molting_now: EVERYTHING_BUT_PREY,
  premolt_seen: FEED,
  sac_laid: FEED,
};

function holdReason(
  outcome: HoldOutcome,
  zone: string,
  postMoltHoldDays: number | undefined,
): Reason {
  const day = localDateOf(new Date(outcome.at), zone);
  const time = clockTime(outcome.at, zone);
  switch (outcome.kind) {
    case 'molted': {
      if (!postMoltHoldDays)
        return {
          code: 'post_molt_hold',
          text: `Molted today (${time}): no food while the fangs harden.`,
          dates: [day],
        };
      const until = addDays(day, postMoltHoldDays);
      return {
        code: 'post_molt_hold',
        text: `Molted today (${time}): no food until ${shortDate(until)}.`,
        dates: [until, day],
      };
    }
    case 'molting_now':
      return {
        code: 'leave_alone',
        text: `Molting now (seen ${time}): leave alone — no food, no water, no disturbance.`,
        dates: [day],
      };
    case 'premolt_seen':
      return {
        code: 'premolt',
        text: `Premolt seen today (${time}): no food until it molts; water continues.`,
        dates: [day],
      };
    default:
      return {
        code: 'leave_alone',
        text: `Egg sac laid today (${time}): leave her alone — no food; water quietly when due.`,
        dates: [day],
      };
  }
}

/**
 * The hold started by the day's outcomes, if any: the latest hold-starting outcome wins (a molt
 * after "molting now" turns leave-alone into the post-molt hold). `outcomes` are live and sorted.
 */
export function sameDayHold(
  outcomes: readonly HoldOutcome[],
  zone: string,
  postMoltHoldDays?: number,
): SameDayHold | null {
  for (let i = outcomes.length - 1; i >= 0; i -= 1) {
    const o = outcomes[i]!;
    const withdraws = HOLD_STARTERS[o.kind];
    if (withdraws)
      return {
        eventId: o.eventId,
        at: o.at,
        reason: holdReason(o, zone, postMoltHoldDays),
        withdraws,
      };
  }
  return null;
}
