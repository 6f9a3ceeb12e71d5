import type { HelperReportView } from '#shared/schemas/helper-reports';
import type { Background } from '../../background';
import type { Db } from '../../db/client';
import type { Logger } from '../../logger';
import type { Mailer } from '../../mail/mailer';
import { createCoverArrangements } from './cover-arrangements';
import { createCoverSummaries } from './cover-summary';
import { createHandoverNotes } from './handover-notes';
import { createHelperCover } from './helper-cover';
import { createInviteAcceptance } from './invite-acceptance';

interface Deps {
  mailer: Mailer;
  now: () => Date;
  bcryptCost: number;
  publicUrl: (path: string) => string;
  background: Background;
  logger?: Logger;
  /** The helpers' problem reports of a cover, for its summary (helper-reports sits above cover). */
  problemsBetween: (collectionId: string, from: Date, to: Date) => Promise<HelperReportView[]>;
}

/** Covers, by who does what: the owner arranges them, keepers leave notes, an invite is accepted, a helper covers. */
export function createCoverService(db: Db, deps: Deps) {
  const handover = createHandoverNotes(db, deps.now);
  const summaries = createCoverSummaries(db, deps);
  return {
    covers: createCoverArrangements(db, { ...deps, summaries }),
    summaries,
    handover,
    invites: createInviteAcceptance(db, deps),
    helper: createHelperCover(db, deps.now, handover),
  };
}
export type CoverService = ReturnType<typeof createCoverService>;
