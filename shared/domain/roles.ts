import { describeLocalDate, localDateOf } from './local-dates';
export const ROLES = ['helper', 'keeper', 'owner'] as const;
export type Role = (typeof ROLES)[number];

/** A role may do what every role before it in ROLES may do. */
export function roleAtLeast(role: Role, minimum: Role): boolean {
  return ROLES.indexOf(role) >= ROLES.indexOf(minimum);
}

export type CoverWindowState = 'before' | 'during' | 'after';

/** Where `now` falls against a helper's cover window; open ends mean no limit on that side. */
export function coverWindowState(
  now: Date,
  startsAt: Date | null,
  endsAt: Date | null,
): CoverWindowState {
  if (startsAt && now < startsAt) return 'before';
  if (endsAt && now >= endsAt) return 'after';
  return 'during';
}

/** What a helper sees outside their cover: when it runs (or ran), in the collection's days. */
export function coverWindowMessage(
  m: { collectionName: string; timeZone: string; startsAt: Date | null; endsAt: Date | null },
  now: Date,
): string {
  const first = m.startsAt ? describeLocalDate(localDateOf(m.startsAt, m.timeZone), true) : null;
  // endsAt is the first instant after the cover: the last covered day is the one before it.
  const last = m.endsAt
    ? describeLocalDate(localDateOf(new Date(m.endsAt.getTime() - 1), m.timeZone), true)
    : null;
  if (m.endsAt && now >= m.endsAt)
    return `Your cover for ${m.collectionName} ended on ${last}. Thank you!`;
  if (first && last) return `Your cover for ${m.collectionName} runs from ${first} to ${last}.`;
  return `Your cover for ${m.collectionName} starts on ${first}.`;
}
