/** Every fact the round can record. Events are append-only; `void` cancels one by id. */
export const EVENT_KINDS = [
  'ate',
  'refused',
  'prey_left_in',
  'prey_removed',
  'watered',
  'molted',
  'premolt_seen',
  'premolt_cleared',
  'molting_now',
  'sac_laid',
  'sac_pulled',
  'paired',
  'rebuild_started',
  'rebuild_ended',
  'skipped',
  'void',
  'note',
  'moved',
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
  'molted',
  'premolt_seen',
  'molting_now',
  'skipped',
  'note',
  'void',
];
