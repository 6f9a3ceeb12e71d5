import { addDays, localDateOf, startOfLocalDate } from '#shared/domain/local-dates';
import type { HelperCoverView } from '#shared/schemas/cover';
import type { Membership } from '../../access/memberships';
import type { Db } from '../../db/client';
import { daysOf } from './cover-days';
import {
  acceptedInviteMessage,
  deleteHelperMembership,
  recentEventsOf,
  safetyAcknowledgedAt,
  setSafetyAcknowledged,
} from './cover.repository';
import type { HandoverNotes } from './handover-notes';

/** Days of history a helper sees for each animal on the round. */
const RECENT_DAYS = 14;

/** A helper's own cover: what they see while it runs, reading the safety notes, leaving. */
export function createHelperCover(db: Db, now: () => Date, handover: HandoverNotes) {
  return {
    /** Everything a helper needs for the round: their days, the notes, each round animal's last 14 days. */
    async view(
      m: Pick<Membership, 'collectionId' | 'collectionName' | 'timeZone' | 'startsAt' | 'endsAt'>,
      userId: string,
      roundAnimalIds: string[],
    ): Promise<HelperCoverView> {
      const today = localDateOf(now(), m.timeZone);
      const since = startOfLocalDate(addDays(today, -RECENT_DAYS), m.timeZone);
      const generalNote = await handover.generalNote(m.collectionId);
      const ack = await safetyAcknowledgedAt(db, m.collectionId, userId);
      const message = await acceptedInviteMessage(db, m.collectionId, userId);
      const recent: HelperCoverView['recent'] = {};
      if (roundAnimalIds.length) {
        for (const r of await recentEventsOf(db, m.collectionId, roundAnimalIds, since))
          (recent[r.animalId] ??= []).push({ kind: r.kind, at: r.at.toISOString(), by: r.by });
      }
      const notes = (await handover.notes(m.collectionId, today)).filter((n) =>
        roundAnimalIds.includes(n.animalId),
      );
      return {
        collectionName: m.collectionName,
        ...daysOf(m.startsAt!, m.endsAt!, m.timeZone),
        message,
        safetyAcknowledgedAt: ack?.toISOString() ?? null,
        generalNote,
        notes,
        recent,
      };
    },

    async acknowledgeSafety(collectionId: string, userId: string) {
      await setSafetyAcknowledged(db, collectionId, userId, now());
    },

    async leave(collectionId: string, userId: string) {
      await deleteHelperMembership(db, collectionId, userId);
    },
  };
}
