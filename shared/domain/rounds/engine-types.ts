import type { AnimalGroup, AnimalStatus, Caution, Diet, LifeStage, Sex } from '../animal-facts';
import type { LocalDate } from '../local-dates';
import type { Place } from '../walk-order';
import type { Offer } from './rules';

// The round engine's vocabulary: what it decides about (an animal), and what it answers with
// (tasks and reasons). build-round.ts exports these too.

export interface EngineAnimal {
  id: string;
  labelCode: string;
  name: string;
  scientificName: string;
  group: AnimalGroup;
  lifeStage: LifeStage;
  sex: Sex;
  sizeMm: number | null;
  status: AnimalStatus;
  cautions: Caution[];
  location: (Place & { id: string }) | null;
  hasWaterDish: boolean;
  intervalDays: number | null;
  preyType: string | null;
  preySize: string | null;
  preyCount: number | null;
  /** What a stage fed "by diet" eats (beetle adults, other); null: the group's usual diet. */
  diet?: Diet | null;
  doNotFeedUntil: LocalDate | null;
  /** Where the hold comes from: a handover note names its last day, a keeper's setting its first fed day. */
  doNotFeedBy?: 'keeper' | 'handover';
  /**
   * The date the animal joined the collection in Rackside (arrival or potting up): a settling
   * period (R16), then a first meal. Only given for an animal never fed.
   */
  addedOn: LocalDate | null;
  /**
   * Enclosure care (docs/care-rules.md § Enclosure care): the animal's own "every N days" for
   * misting, moistening the substrate and spot-cleaning; 0 turns it off, null (or absent, in a
   * phone's copy from before these fields) follows the care profile.
   */
  mistEveryDays?: number | null;
  moistenEveryDays?: number | null;
  spotCleanEveryDays?: number | null;
  /** Inside size of its enclosure in mm; height only matters for an arboreal set-up. */
  enclosureLengthMm?: number | null;
  enclosureWidthMm?: number | null;
  enclosureHeightMm?: number | null;
}

export type ReasonCode =
  | 'due_interval'
  | 'due_first_meal'
  | 'due_refusal_retry'
  | 'due_after_hold'
  | 'rebuild'
  | 'carried_over'
  | 'post_molt_hold'
  | 'premolt'
  | 'possible_premolt'
  | 'check_premolt'
  | 'check_substrate'
  | 'do_not_feed'
  | 'settling'
  | 'not_feeding_yet'
  | 'on_mother'
  | 'pupa'
  | 'no_double_meal'
  | 'prey_inside'
  | 'remove_prey'
  | 'prey_may_stay'
  | 'check_prey'
  | 'water_due'
  | 'moisten_substrate'
  | 'mist_due'
  | 'spot_clean_due'
  | 'bolus'
  | 'rehouse_due'
  | 'quiet_care'
  | 'leave_alone'
  | 'mature_male'
  | 'no_more_molts'
  | 'hanging_room'
  | 'inactive'
  | 'not_due';

/** Why a task is on the round, or why food is held back: a code, a sentence, its dates. */
export interface Reason {
  code: ReasonCode;
  text: string;
  dates: LocalDate[];
}

export const TASK_KINDS = [
  'remove_prey',
  'leave_alone',
  'feed',
  'water',
  'mist',
  'moisten',
  'spot_clean',
  'rehouse',
  'check',
] as const;
export type TaskKind = (typeof TASK_KINDS)[number];

export interface RoundTask {
  kind: TaskKind;
  reasons: Reason[];
  offer?: Offer;
  carriedOverDays: number;
  /** Set on a stored round when a hold began during the day (R18). */
  serverWithdrawn?: Reason | null;
}

export interface AnimalDecision {
  animal: EngineAnimal;
  tasks: RoundTask[];
  /** Context that is not a task: holds, flags, "prey may stay", care notes. */
  notes: Reason[];
  nextFeed: LocalDate | null;
  nextWater: LocalDate | null;
}
