import { randomInt, randomUUID } from 'node:crypto';
import bcrypt from 'bcryptjs';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import { LABEL_ALPHABET } from '#shared/domain/label-codes';
import { generateLabelTag } from '#shared/domain/labels/label-payload';
import type { AnimalInput } from '#shared/schemas/animals';
import { animals } from '../server/db/schema/animals';
import { collections, memberships } from '../server/db/schema/collections';
import { users } from '../server/db/schema/users';
import type { TestContext } from './setup/test-app';

export const PASSWORD = 'correct horse battery';

export interface SignedUp {
  agent: ReturnType<TestContext['agent']>;
  userId: string;
  email: string;
  collectionId: string;
}

/**
 * Signs a new person up through the API as a phone would — the e-mail, then the link it
 * receives — so they own a fresh collection, and keeps them signed in.
 */
export async function signUp(
  ctx: TestContext,
  overrides: Partial<{ email: string; password: string; timeZone: string }> = {},
): Promise<SignedUp> {
  const agent = ctx.agent();
  const email = overrides.email ?? `keeper-${randomUUID().slice(0, 8)}@example.test`;
  const token = await signUpLink(ctx, email);
  const res = await agent.post('/api/auth/sign-up/finish').send({
    token,
    password: overrides.password ?? PASSWORD,
    displayName: 'Test Keeper',
    collectionName: 'Test Collection',
    timeZone: overrides.timeZone ?? 'America/Toronto',
  });
  if (res.status !== 201)
    throw new Error(`sign-up failed: ${res.status} ${JSON.stringify(res.body)}`);
  return {
    agent,
    userId: res.body.user.id,
    email,
    collectionId: res.body.memberships[0].collectionId,
  };
}

/** Starts a sign-up for an address without an account and returns the token its e-mail carries. */
export async function signUpLink(ctx: TestContext, email: string): Promise<string> {
  const earlier = new Set(ctx.mailbox.messages);
  const res = await ctx.agent().post('/api/auth/sign-up').send({ email });
  if (res.status !== 202)
    throw new Error(`sign-up failed: ${res.status} ${JSON.stringify(res.body)}`);
  const mail = await ctx.mailbox.waitFor(
    (m) =>
      !earlier.has(m) &&
      m.to.includes(email.toLowerCase()) &&
      m.subject.startsWith('Finish making'),
  );
  return /sign-up\/finish\?token=([\w-]+)/.exec(mail.text)![1]!;
}

/**
 * An owner with a collection written straight to the database, for tests that drive a server
 * in its own process (no test mailbox there): sign in with PASSWORD to get a session.
 */
export async function insertOwner(
  db: NodePgDatabase,
  overrides: Partial<{ email: string; timeZone: string }> = {},
) {
  const email = overrides.email ?? `owner-${randomUUID().slice(0, 8)}@example.test`;
  const [user] = await db
    .insert(users)
    .values({ email, displayName: 'Test Keeper', passwordHash: await bcrypt.hash(PASSWORD, 10) })
    .returning();
  const [collection] = await db
    .insert(collections)
    .values({
      name: 'Test Collection',
      timeZone: overrides.timeZone ?? 'America/Toronto',
      labelTag: generateLabelTag(Math.random),
    })
    .returning();
  await db
    .insert(memberships)
    .values({ collectionId: collection!.id, userId: user!.id, role: 'owner' });
  return { email, userId: user!.id, collectionId: collection!.id };
}

export async function addMember(
  db: NodePgDatabase,
  values: {
    collectionId: string;
    userId: string;
    role: 'keeper' | 'helper';
    startsAt?: Date;
    endsAt?: Date;
  },
) {
  await db.insert(memberships).values(values);
}

/** An animal in the collection for a month (past its settling period, R16), unless `createdAt` says otherwise. */
export async function createAnimal(
  db: NodePgDatabase,
  collectionId: string,
  overrides: Partial<typeof animals.$inferInsert> = {},
) {
  const [row] = await db
    .insert(animals)
    .values({
      collectionId,
      createdAt: new Date(Date.now() - 30 * 86_400_000),
      // Five characters of the label alphabet (32^5 codes): no collisions within a test file.
      labelCode: `TS-${Array.from({ length: 5 }, () => LABEL_ALPHABET[randomInt(LABEL_ALPHABET.length)]).join('')}`,
      name: 'Test animal',
      scientificName: 'Tliltocatl albopilosus',
      group: 'tarantula',
      lifeStage: 'adult',
      // Spot-cleaning (§ Enclosure care) off unless a test turns it on: a bolus task the day
      // after every meal would sit in every other rule's round.
      spotCleanEveryDays: 0,
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
  care: {
    intervalDays: 12,
    preyType: 'cricket',
    preySize: 'large',
    preyCount: 2,
    hasWaterDish: true,
    doNotFeedUntil: null,
  },
  ...overrides,
});
