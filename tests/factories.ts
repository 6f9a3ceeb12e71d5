import { randomUUID } from 'node:crypto';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import { animals } from '../server/db/schema/animals';
import { memberships } from '../server/db/schema/collections';
import type { AnimalInput } from '../shared/schemas/animals';
import type { TestContext } from './setup/test-app';

export const PASSWORD = 'correct horse battery';

export interface SignedUp {
  agent: ReturnType<TestContext['agent']>;
  userId: string;
  email: string;
  collectionId: string;
}

/** Signs a new person up through the API (so they own a fresh collection) and keeps them signed in. */
export async function signUp(ctx: TestContext, overrides: Partial<{ email: string; password: string; timeZone: string }> = {}): Promise<SignedUp> {
  const agent = ctx.agent();
  const email = overrides.email ?? `keeper-${randomUUID().slice(0, 8)}@example.test`;
  const res = await agent.post('/api/auth/sign-up').send({
    email,
    password: overrides.password ?? PASSWORD,
    displayName: 'Test Keeper',
    collectionName: 'Test Collection',
    timeZone: overrides.timeZone ?? 'America/Toronto',
  });
  if (res.status !== 201) throw new Error(`sign-up failed: ${res.status} ${JSON.stringify(res.body)}`);
  return { agent, userId: res.body.user.id, email, collectionId: res.body.memberships[0].collectionId };
}

export async function addMember(
  db: NodePgDatabase,
  values: { collectionId: string; userId: string; role: 'keeper' | 'helper'; startsAt?: Date; endsAt?: Date },
) {
  await db.insert(memberships).values(values);
}

/** An animal in the collection for a month (past its settling period, R16), unless `createdAt` says otherwise. */
export async function createAnimal(db: NodePgDatabase, collectionId: string, overrides: Partial<typeof animals.$inferInsert> = {}) {
  const [row] = await db
    .insert(animals)
    .values({
      collectionId,
      createdAt: new Date(Date.now() - 30 * 86_400_000),
      labelCode: `TS-${randomUUID().slice(0, 4).toUpperCase().replace(/[01IO]/g, 'A')}`,
      name: 'Test animal',
      scientificName: 'Tliltocatl albopilosus',
      group: 'tarantula',
      lifeStage: 'adult',
      ...overrides,
    })
    .returning();
  return row!;
}

/** The `name=value` of the session cookie a response sets, if any. */
export function sessionCookie(res: { headers: Record<string, unknown> }): string | undefined {
  const cookies = (res.headers['set-cookie'] as string[] | undefined) ?? [];
  return cookies.find((c) => c.startsWith('rackside.sid='))?.split(';')[0];
}

/** A complete, valid animal form as the edit page sends it. */
export const animalBody = (overrides: Partial<AnimalInput> = {}): AnimalInput => ({
  name: 'Juniper',
  scientificName: 'Tliltocatl albopilosus (Valerio, 1980)',
  commonName: 'Curly hair',
  group: 'tarantula',
  lifeStage: 'adult',
  sex: 'female',
  sizeMm: 130,
  acquiredOn: '2025-05-01',
  source: 'Expo',
  locationId: null,
  cautions: ['urticating_hairs'],
  cautionNote: 'Flicks hairs when the lid opens',
  notes: null,
  clutch: null,
  care: { intervalDays: 12, preyType: 'cricket', preySize: 'large', preyCount: 2, hasWaterDish: true, doNotFeedUntil: null },
  ...overrides,
});
