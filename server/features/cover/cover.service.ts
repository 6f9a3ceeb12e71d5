import { and, desc, eq, gte, inArray, isNull, sql } from 'drizzle-orm';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import { addDays, describeLocalDate, localDateOf, startOfLocalDate, type LocalDate } from '../../../shared/domain/local-dates';
import { coverWindowState } from '../../../shared/domain/roles';
import type { AcceptBody, CoverState, CoverSummary, HandoverNote, HelperCoverView, InvitePreview } from '../../../shared/schemas/cover';
import type { Background } from '../../background';
import { animals, events, handoverNotes } from '../../db/schema/animals';
import { collections, invites, memberships } from '../../db/schema/collections';
import { users } from '../../db/schema/users';
import type { Mailer } from '../../mail/mailer';
import { HttpError } from '../../middleware/errors';
import { findUserByEmail, insertUser } from '../auth/auth.repository';
import { hashPassword } from '../auth/passwords';
import { roleOfEmail, type Membership } from '../collections/collections.repository';
import { hashInviteToken, INVITE_LIFETIME_MS, newInviteToken } from './invite-token';

const RECENT_DAYS = 14;

const notFound = () => new HttpError(404, 'not_found', 'We could not find that cover.');

interface Deps {
  mailer: Mailer;
  now: () => Date;
  bcryptCost: number;
  publicUrl: (path: string) => string;
  background: Background;
}

export function createCoverService(db: NodePgDatabase, deps: Deps) {
  async function collectionOf(collectionId: string) {
    const [c] = await db.select().from(collections).where(eq(collections.id, collectionId));
    if (!c) throw notFound();
    return c;
  }

  const coverWindow = (firstDay: LocalDate, lastDay: LocalDate, zone: string) => ({
    startsAt: startOfLocalDate(firstDay, zone),
    // The first instant after the last covered day (23 or 25 hours long on DST days).
    endsAt: startOfLocalDate(addDays(lastDay, 1), zone),
  });
  const daysOf = (startsAt: Date, endsAt: Date, zone: string) => ({
    firstDay: localDateOf(startsAt, zone),
    lastDay: localDateOf(new Date(endsAt.getTime() - 1), zone),
  });

  function stateOf(startsAt: Date, endsAt: Date, accepted: boolean): CoverState {
    const when = coverWindowState(deps.now(), startsAt, endsAt);
    if (when === 'after') return 'ended';
    if (!accepted) return 'invited';
    return when === 'during' ? 'running' : 'upcoming';
  }

  async function inviteOf(collectionId: string, coverId: string) {
    const [row] = await db.select().from(invites).where(and(eq(invites.id, coverId), eq(invites.collectionId, collectionId), eq(invites.role, 'helper')));
    if (!row) throw notFound();
    return row;
  }

  async function mailInvite(to: string, token: string, c: { name: string; timeZone: string }, from: string, days: { firstDay: LocalDate; lastDay: LocalDate }, message: string | null) {
    await deps.mailer.send({
      to,
      subject: `${from} asks you to cover the feeds at ${c.name}`,
      text: [
        'Hello,',
        '',
        `${from} asks you to look after the feeding round of ${c.name} from ${describeLocalDate(days.firstDay, true)} to ${describeLocalDate(days.lastDay, true)}.`,
        ...(message ? ['', `Their message: ${message}`] : []),
        '',
        'Open this link to accept (it works once, within a week):',
        '',
        deps.publicUrl(`/cover/accept?token=${token}`),
        '',
        'You will see the round, the animals on it, the keeper’s handover notes and safety cautions — only for those days.',
        'Some of these animals can bite, sting or flick irritating hairs: the app shows how to work safely before your first round.',
      ].join('\n'),
    });
  }

  return {
    /**
     * The owner names a helper and the days; an e-mail carries a single-use link. The same
     * work and answer whether or not the address has an account (decision 012); the e-mail
     * goes after the answer.
     */
    async create(collectionId: string, invitedBy: string, body: { email: string; firstDay: LocalDate; lastDay: LocalDate; message: string }) {
      const c = await collectionOf(collectionId);
      const role = await roleOfEmail(db, collectionId, body.email);
      if (role && role !== 'helper') throw new HttpError(409, 'already_member', 'That person already keeps this collection with you; no cover is needed.');
      const { startsAt, endsAt } = coverWindow(body.firstDay, body.lastDay, c.timeZone);
      if (endsAt <= deps.now()) throw new HttpError(422, 'invalid', 'That cover would already be over. Choose days from today on.', [{ path: 'lastDay', message: 'Choose days from today on.' }]);
      const { token, tokenHash } = newInviteToken();
      const expiresAt = new Date(Math.min(deps.now().getTime() + INVITE_LIFETIME_MS, endsAt.getTime()));
      const [row] = await db
        .insert(invites)
        .values({ collectionId, email: body.email, role: 'helper', tokenHash, message: body.message || null, startsAt, endsAt, expiresAt, invitedBy })
        .returning({ id: invites.id });
      deps.background.run('cover invite mail', async () => {
        const [inviter] = await db.select({ name: users.displayName }).from(users).where(eq(users.id, invitedBy));
        await mailInvite(body.email, token, c, inviter?.name ?? 'A keeper', body, body.message || null);
      });
      return { id: row!.id };
    },

    async list(collectionId: string): Promise<CoverSummary[]> {
      const c = await collectionOf(collectionId);
      const rows = await db
        .select({ invite: invites, helperName: users.displayName, ack: memberships.safetyAcknowledgedAt })
        .from(invites)
        .leftJoin(users, eq(users.id, invites.acceptedBy))
        .leftJoin(memberships, and(eq(memberships.collectionId, invites.collectionId), eq(memberships.userId, invites.acceptedBy)))
        .where(and(eq(invites.collectionId, collectionId), eq(invites.role, 'helper')))
        .orderBy(desc(invites.startsAt));
      return rows.map(({ invite: i, helperName, ack }) => ({
        id: i.id,
        email: i.email,
        helperName,
        ...daysOf(i.startsAt!, i.endsAt!, c.timeZone),
        message: i.message,
        state: stateOf(i.startsAt!, i.endsAt!, !!i.acceptedAt),
        inviteExpired: !i.acceptedAt && i.expiresAt <= deps.now(),
        safetyAcknowledgedAt: ack?.toISOString() ?? null,
      }));
    },

    /** New days or message; the helper's access follows at once (a cover ended early reopens). */
    async change(collectionId: string, coverId: string, body: { firstDay: LocalDate; lastDay: LocalDate; message: string }) {
      const c = await collectionOf(collectionId);
      const invite = await inviteOf(collectionId, coverId);
      const { startsAt, endsAt } = coverWindow(body.firstDay, body.lastDay, c.timeZone);
      await db.transaction(async (tx) => {
        await tx.update(invites).set({ startsAt, endsAt, message: body.message || null }).where(eq(invites.id, invite.id));
        if (invite.acceptedBy) {
          await tx.update(memberships).set({ startsAt, endsAt, writesClosedAt: null }).where(and(eq(memberships.collectionId, collectionId), eq(memberships.userId, invite.acceptedBy), eq(memberships.role, 'helper')));
        }
      });
    },

    /**
     * Ends a cover now: the helper's access stops with the next request, writes included — no
     * grace for taps still on their phone (an early end is a decision, not a calendar). The
     * membership stays, so those taps still get a verdict ("refused") instead of waiting forever.
     */
    async end(collectionId: string, coverId: string) {
      const invite = await inviteOf(collectionId, coverId);
      const now = deps.now();
      await db.transaction(async (tx) => {
        await tx.update(invites).set({ endsAt: now, expiresAt: now }).where(eq(invites.id, invite.id));
        if (invite.acceptedBy) {
          await tx.update(memberships).set({ endsAt: now, writesClosedAt: now }).where(and(eq(memberships.collectionId, collectionId), eq(memberships.userId, invite.acceptedBy), eq(memberships.role, 'helper')));
        }
      });
    },

    /** What the accept page shows before anyone signs in (the link's holder reads the mailbox). */
    async preview(token: string): Promise<InvitePreview> {
      const invite = await this.usableInvite(token);
      const c = await collectionOf(invite.collectionId);
      const [inviter] = invite.invitedBy ? await db.select({ name: users.displayName }).from(users).where(eq(users.id, invite.invitedBy)) : [];
      const days = invite.startsAt && invite.endsAt ? daysOf(invite.startsAt, invite.endsAt, c.timeZone) : { firstDay: null, lastDay: null };
      return {
        role: invite.role === 'keeper' ? 'keeper' : 'helper',
        collectionName: c.name,
        invitedBy: inviter?.name ?? null,
        email: invite.email,
        ...days,
        message: invite.message,
        hasAccount: !!(await findUserByEmail(db, invite.email)),
      };
    },

    async usableInvite(token: string) {
      const [invite] = await db.select().from(invites).where(eq(invites.tokenHash, hashInviteToken(token)));
      if (!invite) throw new HttpError(400, 'invite_invalid', 'This invite link is not valid. Ask the keeper to send a new one.');
      if (invite.acceptedAt) throw new HttpError(400, 'invite_used', 'This invite link was already used. Sign in to see your cover.');
      if (invite.expiresAt <= deps.now()) throw new HttpError(400, 'invite_expired', 'This invite link has expired. Ask the keeper to send a new one.');
      return invite;
    },

    /**
     * Accepting is the only way into someone else's collection: as a helper for exactly the
     * cover's days, or as a keeper. Someone new gets an account; someone with an account must
     * be signed in as the invited e-mail. Returns the user to sign in (the route starts the session).
     */
    async accept(body: AcceptBody, signedInUserId: string | null): Promise<{ userId: string; collectionId: string }> {
      return db.transaction(async (tx) => {
        const invite = await this.usableInvite(body.token);
        const keeper = invite.role === 'keeper';
        const existing = await findUserByEmail(tx, invite.email);
        let userId: string;
        if (existing) {
          if (signedInUserId !== existing.id) {
            throw new HttpError(401, 'sign_in_first', `Sign in as ${invite.email} to accept this ${keeper ? 'invite' : 'cover'}.`);
          }
          userId = existing.id;
        } else {
          if (!body.account) throw new HttpError(422, 'invalid', 'Choose your name and a password to make your account.', [{ path: 'account', message: 'Choose your name and a password.' }]);
          const passwordHash = await hashPassword(body.account.password, deps.bcryptCost);
          userId = (await insertUser(tx, { email: invite.email, displayName: body.account.displayName, passwordHash })).id;
        }
        const [current] = await tx.select({ role: memberships.role }).from(memberships).where(and(eq(memberships.collectionId, invite.collectionId), eq(memberships.userId, userId)));
        if (current && current.role !== 'helper') throw new HttpError(409, 'already_member', keeper ? 'You already keep this collection.' : 'You already keep this collection; no cover is needed.');
        // Claimed once: a second use of the same link finds it accepted.
        const claimed = await tx.update(invites).set({ acceptedAt: deps.now(), acceptedBy: userId }).where(and(eq(invites.id, invite.id), isNull(invites.acceptedAt))).returning({ id: invites.id });
        if (!claimed.length) throw new HttpError(400, 'invite_used', 'This invite link was already used. Sign in to see your collection.');
        // A keeper has no window; a helper who becomes a keeper loses theirs.
        const grant = keeper
          ? { role: 'keeper' as const, startsAt: null, endsAt: null }
          : { role: 'helper' as const, startsAt: invite.startsAt, endsAt: invite.endsAt };
        await tx
          .insert(memberships)
          .values({ collectionId: invite.collectionId, userId, ...grant })
          .onConflictDoUpdate({ target: [memberships.collectionId, memberships.userId], set: { ...grant, writesClosedAt: null, safetyAcknowledgedAt: null } });
        return { userId, collectionId: invite.collectionId };
      });
    },

    async leave(collectionId: string, userId: string) {
      await db.delete(memberships).where(and(eq(memberships.collectionId, collectionId), eq(memberships.userId, userId), eq(memberships.role, 'helper')));
    },

    async acknowledgeSafety(collectionId: string, userId: string) {
      await db.update(memberships).set({ safetyAcknowledgedAt: deps.now() }).where(and(eq(memberships.collectionId, collectionId), eq(memberships.userId, userId)));
    },

    async notes(collectionId: string, from: LocalDate): Promise<HandoverNote[]> {
      const rows = await db
        .select({ n: handoverNotes, animalName: animals.name })
        .from(handoverNotes)
        .innerJoin(animals, eq(animals.id, handoverNotes.animalId))
        .where(and(eq(handoverNotes.collectionId, collectionId), gte(handoverNotes.until, from)))
        .orderBy(handoverNotes.until);
      return rows.map(({ n, animalName }) => ({ id: n.id, animalId: n.animalId, animalName, text: n.text, until: n.until, doNotFeed: n.doNotFeed }));
    },

    async addNote(collectionId: string, userId: string, body: { animalId: string; text: string; until: LocalDate; doNotFeed: boolean }) {
      const [animal] = await db.select({ id: animals.id }).from(animals).where(and(eq(animals.id, body.animalId), eq(animals.collectionId, collectionId)));
      if (!animal) throw new HttpError(404, 'not_found', 'We could not find that animal.');
      const [row] = await db.insert(handoverNotes).values({ collectionId, ...body, createdBy: userId }).returning({ id: handoverNotes.id });
      return { id: row!.id };
    },

    async removeNote(collectionId: string, noteId: string) {
      const deleted = await db.delete(handoverNotes).where(and(eq(handoverNotes.id, noteId), eq(handoverNotes.collectionId, collectionId))).returning({ animalId: handoverNotes.animalId });
      if (!deleted.length) throw new HttpError(404, 'not_found', 'We could not find that note.');
      return deleted[0]!.animalId;
    },

    async setGeneralNote(collectionId: string, text: string) {
      await db.update(collections).set({ handoverNote: text || null }).where(eq(collections.id, collectionId));
    },

    async generalNote(collectionId: string) {
      return (await collectionOf(collectionId)).handoverNote;
    },

    /** Everything a helper needs for the round: their days, the notes, each round animal's last 14 days. */
    async helperView(m: Membership, userId: string, roundAnimalIds: string[]): Promise<HelperCoverView> {
      const c = await collectionOf(m.collectionId);
      const today = localDateOf(deps.now(), c.timeZone);
      const since = startOfLocalDate(addDays(today, -RECENT_DAYS), c.timeZone);
      const [mine] = await db.select({ ack: memberships.safetyAcknowledgedAt }).from(memberships).where(and(eq(memberships.collectionId, m.collectionId), eq(memberships.userId, userId)));
      const [invite] = await db.select({ message: invites.message }).from(invites).where(and(eq(invites.collectionId, m.collectionId), eq(invites.acceptedBy, userId))).orderBy(desc(invites.acceptedAt)).limit(1);
      const recent: HelperCoverView['recent'] = {};
      if (roundAnimalIds.length) {
        const rows = await db
          .select({ animalId: events.animalId, kind: events.kind, at: events.effectiveAt, by: users.displayName })
          .from(events)
          .leftJoin(users, eq(users.id, events.recordedBy))
          .where(and(eq(events.collectionId, m.collectionId), inArray(events.animalId, roundAnimalIds), gte(events.effectiveAt, since), sql`${events.kind} <> 'void'`))
          .orderBy(desc(events.effectiveAt));
        for (const r of rows) (recent[r.animalId] ??= []).push({ kind: r.kind, at: r.at.toISOString(), by: r.by });
      }
      const notes = (await this.notes(m.collectionId, today)).filter((n) => roundAnimalIds.includes(n.animalId));
      return {
        collectionName: c.name,
        ...daysOf(m.startsAt!, m.endsAt!, c.timeZone),
        message: invite?.message ?? null,
        safetyAcknowledgedAt: mine?.ack?.toISOString() ?? null,
        generalNote: c.handoverNote,
        notes,
        recent,
      };
    },
  };
}
export type CoverService = ReturnType<typeof createCoverService>;
