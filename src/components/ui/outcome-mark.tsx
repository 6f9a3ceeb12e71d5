import type { EventKind } from '#shared/domain/event-kinds';

/**
 * How a recorded outcome is marked beside its word: a meal taken is a green tick; food refused
 * or left in is a cross in the attention colour, so the two never look alike (design language:
 * never colour alone, so each has its own symbol too).
 */
const NOT_TAKEN: ReadonlySet<EventKind> = new Set(['refused', 'prey_left_in']);

export function outcomeLook(kind: EventKind): { symbol: string; className: string } {
  if (NOT_TAKEN.has(kind)) return { symbol: '✕', className: 'border-accent text-accent' };
  if (kind === 'skipped') return { symbol: '–', className: 'border-border text-muted' };
  return { symbol: '✓', className: 'border-ok text-ok' };
}
