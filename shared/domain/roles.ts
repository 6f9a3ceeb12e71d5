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
