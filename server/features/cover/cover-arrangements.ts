import { describeLocalDate, type LocalDate } from '#shared/domain/local-dates';
import type { CoverSummary } from '#shared/schemas/cover';
import { INVITE_LIFETIME_MS, newInviteToken } from '../../access/invite-token';
import { roleOfEmail, type MemberCollection } from '../../access/memberships';
import { displayNameOf } from '../../access/users';
import type { Background } from '../../background';
import type { Db } from '../../db/client';
import type { Mailer } from '../../mail/mailer';
import { HttpError } from '../../middleware/errors';
import { coverState, coverWindow, daysOf } from './cover-days';
import { deleteSummary } from './cover-reports.repository';
import type { CoverSummaries } from './cover-summary';
import {
  findCoverInvite,
  insertCoverInvite,
  listCoverInvites,
  updateHelperMembership,
  updateInvite,
} from './cover.repository';

export interface CoverArrangementDeps {
  mailer: Mailer;
  now: () => Date;
  publicUrl: (path: string) => string;
  background: Background;
  summaries: Pick<CoverSummaries, 'afterEarlyEnd'>;
}

const notFound = () => new HttpError(404, 'not_found', 'We could not find that cover.');
const alreadyOver = () =>
  new HttpError(422, 'invalid', 'That cover would already be over. Choose days from today on.', [
    { path: 'lastDay', message: 'Choose days from today on.' },
  ]);

/** An owner's side of covers: naming a helper and the days, changing them, ending one early. */
export function createCoverArrangements(db: Db, deps: CoverArrangementDeps) {
  async function coverOf(collectionId: string, coverId: string) {
    const row = await findCoverInvite(db, collectionId, coverId);
    if (!row) throw notFound();
    return row;
  }

  async function mailInvite(
    to: string,
    token: string,
    collectionName: string,
    from: string,
    days: { firstDay: LocalDate; lastDay: LocalDate },
    message: string | null,
  ) {
    await deps.mailer.send({
      to,
      subject: `${from} asks you to cover the feeds at ${collectionName}`,
      text: [
        'Hello,',
        '',
        `${from} asks you to look after the feeding round of ${collectionName} from ${describeLocalDate(days.firstDay, true)} to ${describeLocalDate(days.lastDay, true)}.`,
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
    async create(
      c: MemberCollection,
      invitedBy: string,
      body: { email: string; firstDay: LocalDate; lastDay: LocalDate; message: string },
    ) {
      const role = await roleOfEmail(db, c.collectionId, body.email);
      if (role && role !== 'helper')
        throw new HttpError(
          409,
          'already_member',
          'That person already keeps this collection with you; no cover is needed.',
        );
      const { startsAt, endsAt } = coverWindow(body.firstDay, body.lastDay, c.timeZone);
      if (endsAt <= deps.now()) throw alreadyOver();
      const { token, tokenHash } = newInviteToken();
      const expiresAt = new Date(
        Math.min(deps.now().getTime() + INVITE_LIFETIME_MS, endsAt.getTime()),
      );
      const id = await insertCoverInvite(db, {
        collectionId: c.collectionId,
        email: body.email,
        tokenHash,
        message: body.message || null,
        startsAt,
        endsAt,
        expiresAt,
        invitedBy,
      });
      deps.background.run('cover invite mail', async () => {
        const from = (await displayNameOf(db, invitedBy)) ?? 'A keeper';
        await mailInvite(body.email, token, c.collectionName, from, body, body.message || null);
      });
      return { id };
    },

    async list(c: MemberCollection): Promise<CoverSummary[]> {
      const rows = await listCoverInvites(db, c.collectionId);
      return rows.map(({ invite: i, helperName, ack, summaryId }) => ({
        id: i.id,
        email: i.email,
        helperName,
        ...daysOf(i.startsAt!, i.endsAt!, c.timeZone),
        message: i.message,
        state: coverState(deps.now(), i.startsAt!, i.endsAt!, !!i.acceptedAt),
        inviteExpired: !i.acceptedAt && i.expiresAt <= deps.now(),
        hasSummary: !!summaryId,
        safetyAcknowledgedAt: ack?.toISOString() ?? null,
      }));
    },

    /**
     * New days or message; the helper's access follows at once (a cover ended early reopens,
     * and its summary is made again when it ends).
     */
    async change(
      c: MemberCollection,
      coverId: string,
      body: { firstDay: LocalDate; lastDay: LocalDate; message: string },
    ) {
      const invite = await coverOf(c.collectionId, coverId);
      const { startsAt, endsAt } = coverWindow(body.firstDay, body.lastDay, c.timeZone);
      if (endsAt <= deps.now()) throw alreadyOver();
      await db.transaction(async (tx) => {
        await updateInvite(tx, invite.id, {
          startsAt,
          endsAt,
          message: body.message || null,
          // An unanswered link never outlives the cover it offers.
          ...(invite.acceptedAt
            ? {}
            : { expiresAt: new Date(Math.min(invite.expiresAt.getTime(), endsAt.getTime())) }),
        });
        if (invite.acceptedBy)
          await updateHelperMembership(tx, c.collectionId, invite.acceptedBy, {
            startsAt,
            endsAt,
            writesClosedAt: null,
          });
        await deleteSummary(tx, invite.id);
      });
    },

    /**
     * The invite again, with a new link (the earlier one stops working), for a cover not yet
     * accepted and not over: a lost or expired e-mail. Mailed after the answer (decision 012).
     */
    async resend(c: MemberCollection, invitedBy: string, coverId: string) {
      const invite = await coverOf(c.collectionId, coverId);
      const now = deps.now();
      if (invite.acceptedAt)
        throw new HttpError(
          409,
          'already_accepted',
          'This cover was accepted already: there is no invite to send again.',
        );
      if (invite.endsAt! <= now) throw alreadyOver();
      const { token, tokenHash } = newInviteToken();
      await updateInvite(db, invite.id, {
        tokenHash,
        expiresAt: new Date(Math.min(now.getTime() + INVITE_LIFETIME_MS, invite.endsAt!.getTime())),
      });
      const days = daysOf(invite.startsAt!, invite.endsAt!, c.timeZone);
      deps.background.run('cover invite mail', async () => {
        const from = (await displayNameOf(db, invitedBy)) ?? 'A keeper';
        await mailInvite(invite.email, token, c.collectionName, from, days, invite.message);
      });
    },

    /**
     * Ends a cover now: the helper's access stops with the next request, writes included — no
     * grace for taps still on their phone (an early end is a decision, not a calendar). The
     * membership stays, so those taps still get a verdict ("refused") instead of waiting forever.
     */
    async end(collectionId: string, coverId: string) {
      const invite = await coverOf(collectionId, coverId);
      const now = deps.now();
      if (invite.endsAt! <= now)
        throw new HttpError(409, 'already_ended', 'This cover has ended already.');
      await db.transaction(async (tx) => {
        await updateInvite(tx, invite.id, { endsAt: now, expiresAt: now });
        if (invite.acceptedBy)
          await updateHelperMembership(tx, collectionId, invite.acceptedBy, {
            endsAt: now,
            writesClosedAt: now,
          });
      });
      // A cover that ran (accepted, begun) gets its summary now, in the app and by e-mail.
      await deps.summaries.afterEarlyEnd(invite.id);
    },
  };
}
