/** Every fact the round can record. Events are append-only; `void` cancels one by id. */
export const EVENT_KINDS = [
  'ate',
  'refused',
  'prey_left_in',
  'prey_removed',
  'watered',
  /** Enclosure care (docs/care-rules.md § Enclosure care): misted, a sling's substrate damped… */
  'misted',
  'substrate_moistened',
  /** … a bolus or prey remains picked out, or the animal moved to a bigger enclosure. */
  'spot_cleaned',
  'rehoused',
  'molted',
  /** Size, exuviae sex or a note added to a molt already recorded (one molt, one record). */
  'molt_details',
  'premolt_seen',
  'premolt_cleared',
  'molting_now',
  'sac_laid',
  'sac_pulled',
  /** The sac hatched with the female (no pull): her guarding ends and her rebuild starts. */
  'sac_hatched',
  /** A mantis egg case (ootheca): recorded on the female, who does not guard it. */
  'case_laid',
  /** A brood (scorplings on her back, or eggs a centipede curls round): she is left alone. */
  'brood_started',
  'brood_dispersed',
  'paired',
  'rebuild_started',
  'rebuild_ended',
  'skipped',
  'void',
  'note',
  'moved',
  /** Retired (sold, deceased, rehomed, on loan) or back in the collection; payload says which. */
  'status_changed',
] as const;
export type EventKind = (typeof EVENT_KINDS)[number];

/**
 * What a helper covering feeds may record: the round's outcomes and notes, and undoing their
 * own taps. Breeding records and moves stay with keepers.
 */
export const HELPER_EVENT_KINDS: readonly EventKind[] = [
  'ate',
  'refused',
  'prey_left_in',
  'prey_removed',
  'watered',
  // Enclosure care a helper can do in passing; rehousing handles the animal, so keepers only.
  'misted',
  'substrate_moistened',
  'spot_cleaned',
  'molted',
  'molt_details',
  'premolt_seen',
  'molting_now',
  'skipped',
  'note',
  'void',
];

/** Plain words for each fact, as buttons and histories show them. */
export const EVENT_WORDS: Record<EventKind, string> = {
  ate: 'Ate',
  refused: 'Refused',
  prey_left_in: 'Prey left in',
  prey_removed: 'Prey removed',
  watered: 'Watered',
  misted: 'Misted',
  substrate_moistened: 'Substrate moistened',
  spot_cleaned: 'Spot-cleaned',
  rehoused: 'Rehoused',
  molted: 'Molted',
  molt_details: 'Molt details',
  premolt_seen: 'Premolt seen',
  premolt_cleared: 'Premolt over',
  molting_now: 'Molting now',
  sac_laid: 'Egg sac laid',
  sac_pulled: 'Egg sac pulled',
  sac_hatched: 'Egg sac hatched',
  case_laid: 'Egg case laid',
  brood_started: 'Brood began',
  brood_dispersed: 'Brood dispersed',
  paired: 'Paired',
  rebuild_started: 'Rebuilding',
  rebuild_ended: 'Rebuild over',
  skipped: 'Skipped',
  void: 'Undone',
  note: 'Note',
  moved: 'Moved',
  status_changed: 'Status changed',
};

/** The flag on a meal recorded while the round engine withheld food (R18): shown to the owner. */
export const FED_WHILE_HELD = 'fed_while_held';
