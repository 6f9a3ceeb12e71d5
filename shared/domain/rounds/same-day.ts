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
  /** The enclosure care it withdraws, with its own words (§ Enclosure care). */
  careReason: Reason;
}

interface HoldOutcome {
  eventId: string;
  kind: EventKind;
  at: string;
}

// A molt: no food, and no rehouse until the fangs harden (R5, R22).
const MOLTED: ReadonlySet<TaskKind> = new Set(['feed', 'rehouse']);
// Molting now: no food, no water, no disturbance (R11); the check is answered by the molt itself.
const EVERYTHING_BUT_PREY: ReadonlySet<TaskKind> = new Set([
  'feed',
  'water',
  'mist',
  'moisten',
  'spot_clean',
  'rehouse',
  'check',
]);
// Premolt: water and misting go on; its web and burrow are left whole (R4, R21, R22).
const PREMOLT: ReadonlySet<TaskKind> = new Set(['feed', 'spot_clean', 'rehouse']);
// A sac laid: disturbed as little as possible — only water and damp substrate, quietly (R11).
const SAC: ReadonlySet<TaskKind> = new Set(['feed', 'mist', 'spot_clean', 'rehouse']);

/** Outcomes that start a hold, and the tasks each withdraws. */
export const HOLD_STARTERS: Partial<Record<EventKind, ReadonlySet<TaskKind>>> = {
  molted: MOLTED,
  molting_now: EVERYTHING_BUT_PREY,
  premolt_seen: PREMOLT,
  sac_laid: SAC,
};

/** The words in place of a withdrawn misting, cleaning or rehouse (§ Enclosure care). */
function careHoldReason(outcome: HoldOutcome, zone: string, base: Reason): Reason {
  const time = clockTime(outcome.at, zone);
  const text =
    outcome.kind === 'molted'
      ? `Molted today (${time}): no rehouse until the post-molt hold is over and the fangs have hardened.`
      : outcome.kind === 'premolt_seen'
        ? `Premolt seen today (${time}): no cleaning or rehouse until it molts — leave its web and burrow whole.`
        : outcome.kind === 'sac_laid'
          ? `Egg sac laid today (${time}): leave her alone — no misting, cleaning or rehouse.`
          : base.text;
  return { ...base, text };
}

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
    if (withdraws) {
      const reason = holdReason(o, zone, postMoltHoldDays);
      return {
        eventId: o.eventId,
        at: o.at,
        reason,
        withdraws,
        careReason: careHoldReason(o, zone, reason),
      };
    }
  }
  return null;
}
