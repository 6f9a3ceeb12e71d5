import { eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { users } from '../db/schema/users';

export async function findUserByEmail(db: Db, email: string) {
  const [row] = await db.select().from(users).where(eq(users.email, email)).limit(1);
  return row ?? null;
}

export async function findUserById(db: Db, id: string) {
  const [row] = await db.select().from(users).where(eq(users.id, id)).limit(1);
  return row ?? null;
}

/** The name a person chose, for e-mails that say who sent them (null when the account is gone). */
export async function displayNameOf(db: Db, id: string) {
  const [row] = await db.select({ name: users.displayName }).from(users).where(eq(users.id, id));
  return row?.name ?? null;
}

export async function insertUser(
  db: Db,
  values: { email: string; displayName: string; passwordHash: string },
) {
  const [row] = await db.insert(users).values(values).returning();
  return row!;
}

/** How this person reads temperatures (°C or °F): on every device and in their e-mails. */
export async function setTemperatureUnit(db: Db, id: string, unit: 'C' | 'F') {
  await db.update(users).set({ temperatureUnit: unit }).where(eq(users.id, id));
}
