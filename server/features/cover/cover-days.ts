import { addDays, localDateOf, startOfLocalDate, type LocalDate } from '#shared/domain/local-dates';
import { coverWindowState } from '#shared/domain/roles';
import type { CoverState } from '#shared/schemas/cover';

/** The instants a cover of these local days runs between, in the collection's zone. */
export const coverWindow = (firstDay: LocalDate, lastDay: LocalDate, zone: string) => ({
  startsAt: startOfLocalDate(firstDay, zone),
  // The first instant after the last covered day (23 or 25 hours long on DST days).
  endsAt: startOfLocalDate(addDays(lastDay, 1), zone),
});

/** The local days a cover window spans. */
export const daysOf = (startsAt: Date, endsAt: Date, zone: string) => ({
  firstDay: localDateOf(startsAt, zone),
  lastDay: localDateOf(new Date(endsAt.getTime() - 1), zone),
});

export function coverState(now: Date, startsAt: Date, endsAt: Date, accepted: boolean): CoverState {
  const when = coverWindowState(now, startsAt, endsAt);
  if (when === 'after') return 'ended';
  if (!accepted) return 'invited';
  return when === 'during' ? 'running' : 'upcoming';
}
