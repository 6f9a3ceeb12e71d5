import type { Background } from '../../background';
import type { Db } from '../../db/client';
import type { Mailer } from '../../mail/mailer';
import { createCoverArrangements } from './cover-arrangements';
import { createHandoverNotes } from './handover-notes';
import { createHelperCover } from './helper-cover';
import { createInviteAcceptance } from './invite-acceptance';

interface Deps {
  mailer: Mailer;
  now: () => Date;
  bcryptCost: number;
  publicUrl: (path: string) => string;
  background: Background;
}

/** Covers, by who does what: the owner arranges them, keepers leave notes, an invite is accepted, a helper covers. */
export function createCoverService(db: Db, deps: Deps) {
  const handover = createHandoverNotes(db, deps.now);
  return {
    covers: createCoverArrangements(db, deps),
    handover,
    invites: createInviteAcceptance(db, deps),
    helper: createHelperCover(db, deps.now, handover),
  };
}
export type CoverService = ReturnType<typeof createCoverService>;
