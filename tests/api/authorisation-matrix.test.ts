// S4 (budgets): every API route × every kind of caller, in one table. The route list comes from
// the Express app itself, so a new route without a row fails this test until someone decides
// who may call it.
import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import sharp from 'sharp';
import type { Test } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { handoverNotes } from '../../server/db/schema/animals';
import { invites, locations, memberships } from '../../server/db/schema/collections';
import { buyers, invoices, sales } from '../../server/db/schema/sales';
import { users } from '../../server/db/schema/users';
import { listRoutes } from '../../server/route-list';
import { addMember, animalBody, createAnimal, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

/**
 * Who may call a route:
 * - `public`: anyone, signed in or not;
 * - `signed-in`: any account;
 * - `helper`: members from helper up, a helper only while the cover runs;
 * - `helper-any-time`: members from helper up, a helper before and after the cover too;
 * - `keeper`, `owner`: members from that role up, never a helper.
 */
type Access = 'public' | 'signed-in' | 'helper' | 'helper-any-time' | 'keeper' | 'owner';
const CALLERS = [
  'anonymous',
  'outsider',
  'helper before',
  'helper during',
  'helper after',
  'keeper',
  'owner',
] as const;
type Caller = (typeof CALLERS)[number];

interface Fixture {
  c: string;
  animalId: string;
  moltId: string;
  sacId: string;
  coverId: string;
  helperId: string;
  keeperId: string;
  newLocation(): Promise<string>;
  newNote(): Promise<string>;
  newMember(): Promise<string>;
  /** A keeper's invite of the owner's collection, still waiting for an answer. */
  newInvite(): Promise<string>;
}

interface Call {
  path: string;
  body?: unknown;
  /** A multipart file field `photo`. */
  file?: Buffer;
}

interface Row {
  access: Access;
  /** The status a caller who may use the route gets for this request. */
  allowed: number;
  call(f: Fixture): Call | Promise<Call>;
  /** Puts back what an allowed call changed, so the next caller meets the same state. */
  restore?(f: Fixture): Promise<void>;
}

// Requests that write send a body the route refuses (422), so the table proves the caller got
// past the membership check without changing anything; where a route needs no body, the
// change is harmless or undone by `restore`.
const TABLE: Record<string, Row> = {
  'GET /api/health': { access: 'public', allowed: 200, call: () => ({ path: '/api/health' }) },
  // LAN mode's facts (lanMode false here); /api/lan/certificate exists only in LAN mode.
  'GET /api/lan': { access: 'public', allowed: 200, call: () => ({ path: '/api/lan' }) },
  'POST /api/auth/sign-up': {
    access: 'public',
    allowed: 422,
    call: () => ({ path: '/api/auth/sign-up', body: {} }),
  },
  'GET /api/auth/sign-up/preview': {
    access: 'public',
    allowed: 422,
    call: () => ({ path: '/api/auth/sign-up/preview?token=x' }),
  },
  'POST /api/auth/sign-up/finish': {
    access: 'public',
    allowed: 422,
    call: () => ({ path: '/api/auth/sign-up/finish', body: {} }),
  },
  // Open to anyone: the set-up form of a server with no account yet (tests/api/first-owner.test.ts).
  'GET /api/auth/first-run': {
    access: 'public',
    allowed: 200,
    call: () => ({ path: '/api/auth/first-run' }),
  },
  'POST /api/auth/first-owner': {
    access: 'public',
    allowed: 422,
    call: () => ({ path: '/api/auth/first-owner', body: {} }),
  },
  'POST /api/auth/sign-in': {
    access: 'public',
    allowed: 422,
    call: () => ({ path: '/api/auth/sign-in', body: {} }),
  },
  'POST /api/auth/sign-out': {
    access: 'public',
    allowed: 204,
    call: () => ({ path: '/api/auth/sign-out' }),
    restore: signBackIn,
  },
  'GET /api/auth/me': { access: 'signed-in', allowed: 200, call: () => ({ path: '/api/auth/me' }) },
  'PATCH /api/auth/me': {
    access: 'signed-in',
    allowed: 422,
    call: () => ({ path: '/api/auth/me', body: {} }),
  },
  'POST /api/auth/password': {
    access: 'signed-in',
    allowed: 422,
    call: () => ({ path: '/api/auth/password', body: {} }),
  },
  'POST /api/auth/reset-request': {
    access: 'public',
    allowed: 422,
    call: () => ({ path: '/api/auth/reset-request', body: {} }),
  },
  'POST /api/auth/reset': {
    access: 'public',
    allowed: 422,
    call: () => ({ path: '/api/auth/reset', body: {} }),
  },
  // The demo's sign-in hints; { demo: false } without DEMO_MODE.
  'GET /api/dev/demo': { access: 'public', allowed: 200, call: () => ({ path: '/api/dev/demo' }) },
  // Public over loopback only, which is where this table calls from. From another host: a
  // signed-in owner, their own mail only (404 otherwise, as if not there); never mounted in production.
  // Both are proven from a real second host in tests/api/dev-mailbox.test.ts.
  'GET /api/dev/mail': { access: 'public', allowed: 200, call: () => ({ path: '/api/dev/mail' }) },
  'GET /api/collections': {
    access: 'signed-in',
    allowed: 200,
    call: () => ({ path: '/api/collections' }),
  },
  'POST /api/collections': {
    access: 'signed-in',
    allowed: 422,
    call: () => ({ path: '/api/collections', body: {} }),
  },
  'GET /api/cover-invites/preview': {
    access: 'public',
    allowed: 422,
    call: () => ({ path: '/api/cover-invites/preview?token=x' }),
  },
  'POST /api/cover-invites/accept': {
    access: 'public',
    allowed: 422,
    call: () => ({ path: '/api/cover-invites/accept', body: {} }),
  },

  'GET /api/collections/:collectionId': {
    access: 'helper',
    allowed: 200,
    call: (f) => ({ path: f.c }),
  },
  // The wrong name typed: refused (422) before anything is deleted.
  'DELETE /api/collections/:collectionId': {
    access: 'owner',
    allowed: 422,
    call: (f) => ({ path: f.c, body: { confirmName: 'Not its name' } }),
  },
  'GET /api/collections/:collectionId/members': {
    access: 'owner',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/members` }),
  },
  'POST /api/collections/:collectionId/members': {
    access: 'owner',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/members`, body: {} }),
  },
  'DELETE /api/collections/:collectionId/members/:userId': {
    access: 'owner',
    allowed: 204,
    call: async (f) => ({ path: `${f.c}/members/${await f.newMember()}` }),
  },
  'POST /api/collections/:collectionId/invites/:inviteId/resend': {
    access: 'owner',
    allowed: 202,
    call: async (f) => ({ path: `${f.c}/invites/${await f.newInvite()}/resend` }),
  },
  'DELETE /api/collections/:collectionId/invites/:inviteId': {
    access: 'owner',
    allowed: 204,
    call: async (f) => ({ path: `${f.c}/invites/${await f.newInvite()}` }),
  },
  // A keeper leaves (and is put back for the next caller); an owner cannot leave their own.
  'DELETE /api/collections/:collectionId/membership': {
    access: 'keeper',
    allowed: 204,
    call: (f) => ({ path: `${f.c}/membership` }),
    restore: (f) =>
      addMember(ctx.database.db, {
        collectionId: owner.collectionId,
        userId: f.keeperId,
        role: 'keeper',
      }),
  },

  'GET /api/collections/:collectionId/rounds/today': {
    access: 'helper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/rounds/today` }),
  },
  'GET /api/collections/:collectionId/rounds/tomorrow': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/rounds/tomorrow` }),
  },
  'GET /api/collections/:collectionId/rounds/engine-input': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/rounds/engine-input` }),
  },
  'GET /api/collections/:collectionId/prep-list': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/prep-list?date=2026-12-12` }),
  },
  'GET /api/collections/:collectionId/animals/:animalId/schedule': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/animals/${f.animalId}/schedule` }),
  },
  'PATCH /api/collections/:collectionId/animals/:animalId/care': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/animals/${f.animalId}/care`, body: { intervalDays: -1 } }),
  },
  'GET /api/collections/:collectionId/rules': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/rules` }),
  },
  'PUT /api/collections/:collectionId/rules': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({
      path: `${f.c}/rules`,
      body: { profiles: { tarantula: { stages: { adult: { refusalStreak: -1 } } } } },
    }),
  },

  // Feeder colonies: keepers and owners; helpers see none of it. An id that
  // is not one of the collection's colonies is not found; bodies the route refuses are 422.
  'GET /api/collections/:collectionId/colonies': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/colonies` }),
  },
  'POST /api/collections/:collectionId/colonies': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/colonies`, body: {} }),
  },
  'PUT /api/collections/:collectionId/colonies/:colonyId': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/colonies/${randomUUID()}`, body: {} }),
  },
  'DELETE /api/collections/:collectionId/colonies/:colonyId': {
    access: 'keeper',
    allowed: 404,
    call: (f) => ({ path: `${f.c}/colonies/${randomUUID()}` }),
  },
  'POST /api/collections/:collectionId/colonies/:colonyId/counts': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/colonies/${randomUUID()}/counts`, body: {} }),
  },
  'GET /api/collections/:collectionId/colonies/:colonyId/history': {
    access: 'keeper',
    allowed: 404,
    call: (f) => ({ path: `${f.c}/colonies/${randomUUID()}/history` }),
  },
  // Chores: a helper may sync theirs after the cover too (each judged on its own: a room's
  // reading taken during the cover is kept, colony care never; room-readings-exactly-once).
  'POST /api/collections/:collectionId/chores': {
    access: 'helper-any-time',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/chores`, body: {} }),
  },

  'POST /api/collections/:collectionId/events': {
    access: 'helper-any-time',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/events`, body: {} }),
  },
  'GET /api/collections/:collectionId/events': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/events?animalId=${f.animalId}` }),
  },

  'GET /api/collections/:collectionId/animals': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/animals` }),
  },
  'POST /api/collections/:collectionId/animals': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/animals`, body: {} }),
  },
  'POST /api/collections/:collectionId/animals/move': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/animals/move`, body: {} }),
  },
  'GET /api/collections/:collectionId/animals/:animalId': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/animals/${f.animalId}` }),
  },
  'PUT /api/collections/:collectionId/animals/:animalId': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/animals/${f.animalId}`, body: {} }),
  },
  'POST /api/collections/:collectionId/animals/:animalId/retire': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/animals/${f.animalId}/retire`, body: {} }),
  },
  'POST /api/collections/:collectionId/animals/:animalId/reinstate': {
    access: 'keeper',
    allowed: 409,
    call: (f) => ({ path: `${f.c}/animals/${f.animalId}/reinstate`, body: {} }),
  },
  'POST /api/collections/:collectionId/animals/:animalId/relabel': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/animals/${f.animalId}/relabel` }),
  },
  'PUT /api/collections/:collectionId/animals/:animalId/photo': {
    access: 'keeper',
    allowed: 400,
    call: (f) => ({ path: `${f.c}/animals/${f.animalId}/photo` }),
  },
  'GET /api/collections/:collectionId/animals/:animalId/photo': {
    access: 'helper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/animals/${f.animalId}/photo` }),
  },
  'DELETE /api/collections/:collectionId/animals/:animalId/photo': {
    access: 'keeper',
    allowed: 204,
    call: (f) => ({ path: `${f.c}/animals/${f.animalId}/photo` }),
    restore: (f) => putPhoto(`${f.c}/animals/${f.animalId}/photo`),
  },
  'PUT /api/collections/:collectionId/animals/:animalId/molts/:eventId/photo': {
    access: 'keeper',
    allowed: 400,
    call: (f) => ({ path: `${f.c}/animals/${f.animalId}/molts/${f.moltId}/photo` }),
  },
  'GET /api/collections/:collectionId/animals/:animalId/molts/:eventId/photo': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/animals/${f.animalId}/molts/${f.moltId}/photo` }),
  },
  'PUT /api/collections/:collectionId/animals/:animalId/events/:eventId/photo': {
    access: 'keeper',
    allowed: 400,
    call: (f) => ({ path: `${f.c}/animals/${f.animalId}/events/${f.moltId}/photo` }),
  },
  'GET /api/collections/:collectionId/animals/:animalId/events/:eventId/photo': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/animals/${f.animalId}/events/${f.moltId}/photo` }),
  },

  'GET /api/collections/:collectionId/locations': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/locations` }),
  },
  'POST /api/collections/:collectionId/locations': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/locations`, body: {} }),
  },
  'PUT /api/collections/:collectionId/locations/order': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/locations/order`, body: {} }),
  },
  'POST /api/collections/:collectionId/locations/rename': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/locations/rename`, body: {} }),
  },
  'PATCH /api/collections/:collectionId/locations/:locationId': {
    access: 'keeper',
    allowed: 422,
    call: async (f) => ({ path: `${f.c}/locations/${await f.newLocation()}`, body: { rack: 7 } }),
  },
  'DELETE /api/collections/:collectionId/locations/:locationId': {
    access: 'keeper',
    allowed: 204,
    call: async (f) => ({ path: `${f.c}/locations/${await f.newLocation()}` }),
  },

  'GET /api/collections/:collectionId/export/animals.csv': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/export/animals.csv` }),
  },
  'GET /api/collections/:collectionId/export/events.csv': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/export/events.csv` }),
  },
  'POST /api/collections/:collectionId/animals/import': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/animals/import`, body: {} }),
  },
  'GET /api/collections/:collectionId/backup': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/backup` }),
  },
  // The collection has animals: refused (409) before the upload is read.
  'POST /api/collections/:collectionId/restore': {
    access: 'owner',
    allowed: 409,
    call: (f) => ({ path: `${f.c}/restore`, body: {} }),
  },
  'POST /api/collections/:collectionId/labels/pdf': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/labels/pdf`, body: {} }),
  },

  'GET /api/collections/:collectionId/covers': {
    access: 'owner',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/covers` }),
  },
  'POST /api/collections/:collectionId/covers': {
    access: 'owner',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/covers`, body: {} }),
  },
  'PUT /api/collections/:collectionId/covers/:coverId': {
    access: 'owner',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/covers/${f.coverId}`, body: {} }),
  },
  // The fixture's cover is not accepted yet: its invite goes again.
  'POST /api/collections/:collectionId/covers/:coverId/resend': {
    access: 'owner',
    allowed: 202,
    call: (f) => ({ path: `${f.c}/covers/${f.coverId}/resend` }),
  },
  'POST /api/collections/:collectionId/covers/:coverId/end': {
    access: 'owner',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/covers/${f.coverId}/end` }),
    restore: reopenCover,
  },
  'GET /api/collections/:collectionId/handover': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/handover` }),
  },
  'PUT /api/collections/:collectionId/handover/general': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/handover/general`, body: {} }),
  },
  'POST /api/collections/:collectionId/handover/notes': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/handover/notes`, body: {} }),
  },
  'DELETE /api/collections/:collectionId/handover/notes/:noteId': {
    access: 'keeper',
    allowed: 204,
    call: async (f) => ({ path: `${f.c}/handover/notes/${await f.newNote()}` }),
  },
  'GET /api/collections/:collectionId/cover-reports': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/cover-reports` }),
  },
  'POST /api/collections/:collectionId/helper-reports': {
    access: 'helper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/helper-reports`, body: {} }),
  },
  // Room climate: a covering helper sees today's rooms (their reading is a chore: POST /chores);
  // the rest is the keepers'.
  'GET /api/collections/:collectionId/climate/today': {
    access: 'helper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/climate/today` }),
  },
  'GET /api/collections/:collectionId/climate/rooms': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/climate/rooms` }),
  },
  'PUT /api/collections/:collectionId/climate/targets': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/climate/targets`, body: {} }),
  },
  'GET /api/collections/:collectionId/climate/history': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/climate/history` }),
  },
  'POST /api/collections/:collectionId/climate/import': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/climate/import`, body: {} }),
  },
  'GET /api/collections/:collectionId/climate/animals/:animalId': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/climate/animals/${f.animalId}` }),
  },
  'GET /api/collections/:collectionId/helper-reports': {
    access: 'owner',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/helper-reports` }),
  },
  'GET /api/collections/:collectionId/cover/mine': {
    access: 'helper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/cover/mine` }),
  },
  'POST /api/collections/:collectionId/cover/mine/acknowledge': {
    access: 'helper',
    allowed: 204,
    call: (f) => ({ path: `${f.c}/cover/mine/acknowledge` }),
  },
  'DELETE /api/collections/:collectionId/cover/mine': {
    access: 'helper-any-time',
    allowed: 204,
    call: (f) => ({ path: `${f.c}/cover/mine` }),
    restore: reopenCover,
  },

  'GET /api/collections/:collectionId/egg-sacs': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/egg-sacs` }),
  },
  'POST /api/collections/:collectionId/egg-sacs': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/egg-sacs`, body: {} }),
  },
  'PATCH /api/collections/:collectionId/egg-sacs/:sacId': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/egg-sacs/${f.sacId}`, body: { pulledOn: 'soon' } }),
  },
  'POST /api/collections/:collectionId/egg-sacs/:sacId/slings': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/egg-sacs/${f.sacId}/slings`, body: {} }),
  },
  'PUT /api/collections/:collectionId/incubation': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/incubation`, body: {} }),
  },
  // Sales — listings, availability, care sheets (L). Helpers never see a price or the list's link.
  'GET /api/collections/:collectionId/listings': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/listings` }),
  },
  'POST /api/collections/:collectionId/listings/bulk': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/listings/bulk`, body: {} }),
  },
  'PUT /api/collections/:collectionId/listings/:animalId': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/listings/${f.animalId}`, body: { priceMinor: 'a lot' } }),
  },
  'DELETE /api/collections/:collectionId/listings/:animalId': {
    access: 'keeper',
    // The fixture's animal is not offered: past the membership check, nothing to remove.
    allowed: 404,
    call: (f) => ({ path: `${f.c}/listings/${f.animalId}` }),
  },
  'GET /api/collections/:collectionId/availability': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/availability` }),
  },
  'PUT /api/collections/:collectionId/availability': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/availability`, body: {} }),
  },
  'POST /api/collections/:collectionId/availability/new-link': {
    access: 'keeper',
    // A new link for a list that stays off: harmless to repeat.
    allowed: 200,
    call: (f) => ({ path: `${f.c}/availability/new-link` }),
  },
  'GET /api/collections/:collectionId/animals/:animalId/care-sheet.pdf': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/animals/${f.animalId}/care-sheet.pdf` }),
  },
  'GET /api/collections/:collectionId/animals/:animalId/history.csv': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/animals/${f.animalId}/history.csv` }),
  },
  // The public list: a link that was never made is not found, for everyone alike.
  'GET /api/available/:token': {
    access: 'public',
    allowed: 404,
    call: () => ({ path: '/api/available/AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA' }),
  },
  'GET /api/available/:token/list.csv': {
    access: 'public',
    allowed: 404,
    call: () => ({ path: '/api/available/AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA/list.csv' }),
  },

  // Sales — payments. The webhook is public but signed: unsigned, it is refused (400) for
  // anyone. The invoice routes get a malformed invoice id (422 after the membership check).
  'POST /api/payments/webhook': {
    access: 'public',
    allowed: 400,
    call: () => ({ path: '/api/payments/webhook', body: { id: 'evt_unsigned' } }),
  },
  'POST /api/collections/:collectionId/invoices/:invoiceId/checkout': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/invoices/not-an-id/checkout` }),
  },
  'GET /api/collections/:collectionId/invoices/:invoiceId/payments': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/invoices/not-an-id/payments` }),
  },
  'POST /api/collections/:collectionId/invoices/:invoiceId/payments': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/invoices/${randomUUID()}/payments`, body: {} }),
  },
  'POST /api/collections/:collectionId/invoices/:invoiceId/refund': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/invoices/${randomUUID()}/refund`, body: {} }),
  },
  // Sales — S: owners and keepers only; helpers never see prices, buyers or sales (403). Reads
  // use real records (salesRecords); writes send a body the route refuses (422) or an id that
  // is no record of the collection (404), so nothing changes.
  'GET /api/collections/:collectionId/sales-settings': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/sales-settings` }),
  },
  'PUT /api/collections/:collectionId/sales-settings': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/sales-settings`, body: {} }),
  },
  'GET /api/collections/:collectionId/buyers': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/buyers` }),
  },
  'POST /api/collections/:collectionId/buyers': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/buyers`, body: {} }),
  },
  'GET /api/collections/:collectionId/buyers/:buyerId': {
    access: 'keeper',
    allowed: 200,
    call: async (f) => ({ path: `${f.c}/buyers/${(await salesRecords(f)).buyerId}` }),
  },
  'PATCH /api/collections/:collectionId/buyers/:buyerId': {
    access: 'keeper',
    allowed: 422,
    call: async (f) => ({ path: `${f.c}/buyers/${(await salesRecords(f)).buyerId}`, body: {} }),
  },
  'DELETE /api/collections/:collectionId/buyers/:buyerId': {
    access: 'keeper',
    allowed: 404,
    call: (f) => ({ path: `${f.c}/buyers/${randomUUID()}` }),
  },
  'GET /api/collections/:collectionId/sales': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/sales` }),
  },
  'GET /api/collections/:collectionId/sales/available': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/sales/available` }),
  },
  'POST /api/collections/:collectionId/sales': {
    access: 'keeper',
    allowed: 422,
    call: (f) => ({ path: `${f.c}/sales`, body: {} }),
  },
  'GET /api/collections/:collectionId/sales/:saleId': {
    access: 'keeper',
    allowed: 200,
    call: async (f) => ({ path: `${f.c}/sales/${(await salesRecords(f)).saleId}` }),
  },
  'PATCH /api/collections/:collectionId/sales/:saleId': {
    access: 'keeper',
    allowed: 422,
    call: async (f) => ({ path: `${f.c}/sales/${(await salesRecords(f)).saleId}`, body: {} }),
  },
  'POST /api/collections/:collectionId/sales/:saleId/cancel': {
    access: 'keeper',
    allowed: 404,
    call: (f) => ({ path: `${f.c}/sales/${randomUUID()}/cancel` }),
  },
  'POST /api/collections/:collectionId/sales/:saleId/invoice': {
    access: 'keeper',
    allowed: 422,
    call: async (f) => ({
      path: `${f.c}/sales/${(await salesRecords(f)).saleId}/invoice`,
      body: { shippingMinor: -1 },
    }),
  },
  'GET /api/collections/:collectionId/invoices/:invoiceId': {
    access: 'keeper',
    allowed: 200,
    call: async (f) => ({ path: `${f.c}/invoices/${(await salesRecords(f)).invoiceId}` }),
  },
  'GET /api/collections/:collectionId/invoices/:invoiceId/invoice.pdf': {
    access: 'keeper',
    allowed: 200,
    call: async (f) => ({
      path: `${f.c}/invoices/${(await salesRecords(f)).invoiceId}/invoice.pdf`,
    }),
  },
  'POST /api/collections/:collectionId/invoices/:invoiceId/email': {
    access: 'keeper',
    allowed: 404,
    call: (f) => ({ path: `${f.c}/invoices/${randomUUID()}/email` }),
  },
  'POST /api/collections/:collectionId/invoices/:invoiceId/cancel': {
    access: 'keeper',
    allowed: 404,
    call: (f) => ({ path: `${f.c}/invoices/${randomUUID()}/cancel` }),
  },
  'PUT /api/collections/:collectionId/sales/:saleId/shipping': {
    access: 'keeper',
    allowed: 422,
    call: async (f) => ({
      path: `${f.c}/sales/${(await salesRecords(f)).saleId}/shipping`,
      body: {},
    }),
  },
  'POST /api/collections/:collectionId/sales/:saleId/shipping/confirm': {
    access: 'keeper',
    allowed: 422,
    call: async (f) => ({
      path: `${f.c}/sales/${(await salesRecords(f)).saleId}/shipping/confirm`,
      body: { shipAnyway: 'yes' },
    }),
  },
  'POST /api/collections/:collectionId/sales/:saleId/ship': {
    access: 'keeper',
    allowed: 404,
    call: (f) => ({ path: `${f.c}/sales/${randomUUID()}/ship` }),
  },
  'GET /api/collections/:collectionId/animals/:animalId/sale': {
    access: 'keeper',
    allowed: 200,
    call: (f) => ({ path: `${f.c}/animals/${f.animalId}/sale` }),
  },
};

// Sales — S: a buyer, a reserved sale and its open invoice, written once for the table's reads.
let salesRecordsMade: Promise<{ buyerId: string; saleId: string; invoiceId: string }> | undefined;
function salesRecords(f: Fixture) {
  salesRecordsMade ??= (async () => {
    const db = ctx.database.db;
    const collectionId = f.c.split('/').pop()!;
    const [buyer] = await db
      .insert(buyers)
      .values({ collectionId, name: 'Matrix buyer' })
      .returning();
    const [sale] = await db
      .insert(sales)
      .values({ collectionId, buyerId: buyer!.id, reservedUntil: '2026-12-31' })
      .returning();
    const [invoice] = await db
      .insert(invoices)
      .values({
        collectionId,
        saleId: sale!.id,
        number: '2026-9999',
        currency: 'EUR',
        taxRateBp: 0,
        taxRounding: 'per_invoice',
        subtotalMinor: 0,
        taxMinor: 0,
        totalMinor: 0,
        issuedOn: '2026-12-01',
      })
      .returning();
    return { buyerId: buyer!.id, saleId: sale!.id, invoiceId: invoice!.id };
  })();
  return salesRecordsMade;
}

// Some routes answer a non-helper member differently from a helper on purpose.
const EXCEPTIONS: Partial<Record<string, Partial<Record<Caller, number>>>> = {
  // A keeper or owner has no cover of their own to read or leave.
  'GET /api/collections/:collectionId/cover/mine': { keeper: 404, owner: 404 },
  'DELETE /api/collections/:collectionId/cover/mine': { keeper: 404, owner: 404 },
  'POST /api/collections/:collectionId/cover/mine/acknowledge': { keeper: 404, owner: 404 },
  'DELETE /api/collections/:collectionId/membership': { owner: 409 },
};

function expectedStatus(key: string, row: Row, caller: Caller): number {
  const exception = EXCEPTIONS[key]?.[caller];
  if (exception !== undefined) return exception;
  const { access, allowed } = row;
  if (access === 'public') return allowed;
  if (caller === 'anonymous') return 401;
  if (access === 'signed-in') return allowed;
  // A collection route: a non-member learns nothing, not even that the collection exists.
  if (caller === 'outsider') return 404;
  if (caller === 'helper during')
    return access === 'helper' || access === 'helper-any-time' ? allowed : 403;
  if (caller === 'helper before' || caller === 'helper after')
    return access === 'helper-any-time' ? allowed : 403;
  if (caller === 'keeper') return access === 'owner' ? 403 : allowed;
  return allowed;
}

// The helper covers 10–16 Dec 2026 in Toronto (UTC−5 in winter, per the IANA tz database).
const COVER = {
  startsAt: new Date('2026-12-10T05:00:00Z'),
  endsAt: new Date('2026-12-17T05:00:00Z'),
};
const WHEN: Record<Caller, Date | null> = {
  anonymous: null,
  outsider: null,
  'helper before': new Date('2026-12-05T15:00:00Z'),
  'helper during': new Date('2026-12-12T15:00:00Z'),
  'helper after': new Date('2026-12-20T15:00:00Z'),
  keeper: null,
  owner: null,
};

let ctx: TestContext;
let owner: SignedUp;
let keeper: SignedUp;
let helper: SignedUp;
let outsider: SignedUp;
let fixture: Fixture;
let agents: Record<Caller, ReturnType<TestContext['agent']>>;
let jpeg: Buffer;

async function putPhoto(path: string) {
  const res = await owner.agent
    .put(path)
    .attach('photo', jpeg, { filename: 'p.jpg', contentType: 'image/jpeg' });
  expect(res.status, JSON.stringify(res.body)).toBeLessThan(300);
}

async function reopenCover(f: Fixture) {
  const db = ctx.database.db;
  // The fixture's cover (10–12 Jan 2027), which the owner just ended.
  await db
    .update(invites)
    .set({ endsAt: new Date('2027-01-13T05:00:00Z'), expiresAt: new Date('2027-01-13T05:00:00Z') })
    .where(eq(invites.id, f.coverId));
  const [row] = await db
    .select()
    .from(memberships)
    .where(
      and(eq(memberships.userId, f.helperId), eq(memberships.collectionId, owner.collectionId)),
    );
  if (row)
    await db
      .update(memberships)
      .set({ ...COVER, writesClosedAt: null })
      .where(eq(memberships.id, row.id));
  else
    await addMember(db, {
      collectionId: owner.collectionId,
      userId: f.helperId,
      role: 'helper',
      ...COVER,
    });
}

async function signBackIn() {
  // sign-out ends whichever session made the call; each caller signs in again with a fresh agent.
  for (const [caller, who] of [
    ['outsider', outsider],
    ['helper before', helper],
    ['helper during', helper],
    ['helper after', helper],
    ['keeper', keeper],
    ['owner', owner],
  ] as const) {
    const again = ctx.agent();
    await again
      .post('/api/auth/sign-in')
      .send({ email: who.email, password: 'correct horse battery' })
      .expect(200);
    agents[caller] = again;
  }
  owner.agent = agents.owner;
}

beforeAll(async () => {
  ctx = await createTestContext();
  const db = ctx.database.db;
  [owner, keeper, helper, outsider] = [
    await signUp(ctx),
    await signUp(ctx),
    await signUp(ctx),
    await signUp(ctx),
  ];
  await addMember(db, { collectionId: owner.collectionId, userId: keeper.userId, role: 'keeper' });
  await addMember(db, {
    collectionId: owner.collectionId,
    userId: helper.userId,
    role: 'helper',
    ...COVER,
  });
  await db
    .update(memberships)
    .set({ safetyAcknowledgedAt: COVER.startsAt })
    .where(eq(memberships.userId, helper.userId));
  jpeg = await sharp({ create: { width: 32, height: 24, channels: 3, background: '#884422' } })
    .jpeg()
    .toBuffer();

  const c = `/api/collections/${owner.collectionId}`;
  const animal = await createAnimal(db, owner.collectionId, { name: 'Juniper', sex: 'female' });
  await putPhoto(`${c}/animals/${animal.id}/photo`);
  const moltId = randomUUID();
  await owner.agent
    .post(`${c}/events`)
    .send({
      deviceId: 'matrix',
      clientSentAt: new Date().toISOString(),
      events: [
        {
          id: moltId,
          animalId: animal.id,
          kind: 'molted',
          payload: {},
          clientRecordedAt: new Date().toISOString(),
        },
      ],
    })
    .expect(200);
  await putPhoto(`${c}/animals/${animal.id}/molts/${moltId}/photo`);
  const sac = await owner.agent
    .post(`${c}/egg-sacs`)
    .send({ femaleId: animal.id, laidOn: '2026-11-01' })
    .expect(201);
  const covers = await owner.agent.get(`${c}/covers`).expect(200);
  await owner.agent
    .post(`${c}/covers`)
    .send({
      email: `other-helper-${randomUUID().slice(0, 6)}@example.test`,
      firstDay: '2027-01-10',
      lastDay: '2027-01-12',
      message: '',
    })
    .expect(201);
  const listed = (await owner.agent.get(`${c}/covers`).expect(200)).body.covers as { id: string }[];
  const known = new Set((covers.body.covers as { id: string }[]).map((x) => x.id));

  fixture = {
    c,
    animalId: animal.id,
    moltId,
    sacId: sac.body.id ?? sac.body.sac?.id,
    coverId: listed.find((x) => !known.has(x.id))!.id,
    helperId: helper.userId,
    keeperId: keeper.userId,
    newLocation: async () =>
      (
        await db
          .insert(locations)
          .values({
            collectionId: owner.collectionId,
            room: 'Matrix room',
            rack: 'M',
            shelf: '1',
            position: randomUUID().slice(0, 6),
          })
          .returning()
      )[0]!.id,
    newNote: async () =>
      (
        await db
          .insert(handoverNotes)
          .values({
            collectionId: owner.collectionId,
            animalId: animal.id,
            text: 'Matrix note',
            until: '2026-12-31',
            createdBy: owner.userId,
          })
          .returning()
      )[0]!.id,
    newMember: async () => {
      // Straight into the database: this person never signs in, they are only removed.
      const [someone] = await db
        .insert(users)
        .values({
          email: `member-${randomUUID().slice(0, 8)}@example.test`,
          displayName: 'Matrix member',
          passwordHash: 'not a usable hash',
        })
        .returning();
      await addMember(db, {
        collectionId: owner.collectionId,
        userId: someone!.id,
        role: 'keeper',
      });
      return someone!.id;
    },
    newInvite: async () =>
      (
        await db
          .insert(invites)
          .values({
            collectionId: owner.collectionId,
            email: `invited-${randomUUID().slice(0, 8)}@example.test`,
            role: 'keeper',
            tokenHash: randomUUID(),
            expiresAt: new Date(Date.now() + 86_400_000),
          })
          .returning()
      )[0]!.id,
  };
  agents = {
    anonymous: ctx.agent(),
    outsider: outsider.agent,
    'helper before': helper.agent,
    'helper during': helper.agent,
    'helper after': helper.agent,
    keeper: keeper.agent,
    owner: owner.agent,
  };
});
afterAll(async () => {
  ctx.setNow(null);
  await ctx.close();
});

function send(agent: ReturnType<TestContext['agent']>, method: string, call: Call): Test {
  const req = (agent as unknown as Record<string, (p: string) => Test>)[method.toLowerCase()]!(
    call.path,
  );
  if (call.file)
    return req.attach('photo', call.file, { filename: 'p.jpg', contentType: 'image/jpeg' });
  return call.body === undefined ? req : req.send(call.body as object);
}

describe('S4: the authorisation matrix', () => {
  it('has a row for every API route the app answers, and no row for a route that is gone', () => {
    const routes = listRoutes(ctx.app).map((r) => `${r.method} ${r.path}`);
    expect(routes.length).toBeGreaterThan(60);
    expect(routes.filter((r) => !(r in TABLE))).toEqual([]);
    expect(Object.keys(TABLE).filter((k) => !routes.includes(k))).toEqual([]);
  });

  it('gives every caller the expected status on every route', async () => {
    const seen: string[] = [];
    const cells: string[] = [];
    for (const [key, row] of Object.entries(TABLE)) {
      const method = key.split(' ')[0]!;
      for (const caller of CALLERS) {
        ctx.setNow(WHEN[caller]);
        const expected = expectedStatus(key, row, caller);
        const res = await send(agents[caller], method, await row.call(fixture));
        ctx.setNow(null);
        cells.push(`${key} ${caller}`);
        if (res.status !== expected)
          seen.push(
            `${key} as ${caller}: ${res.status} ${JSON.stringify(res.body).slice(0, 120)}, expected ${expected}`,
          );
        // Every refusal is a JSON error a person can read.
        if (res.status >= 400) {
          if (!(typeof res.body?.error?.message === 'string' && res.body.error.message.length > 5))
            seen.push(`${key} as ${caller}: ${res.status} without a readable JSON message`);
        }
        if (res.status < 300 && row.restore) await row.restore(fixture);
      }
    }
    expect(seen).toEqual([]);
    expect(cells).toHaveLength(Object.keys(TABLE).length * CALLERS.length);
    // About 600 requests, one after another: on a loaded 2-core machine that is well over 30 s.
  }, 180_000);
});

describe('ids from another collection, inside your own', () => {
  it('are not found on any route that takes one, and nothing of the other collection changes', async () => {
    const db = ctx.database.db;
    // The outsider's own collection holds the "foreign" records.
    const o = `/api/collections/${outsider.collectionId}`;
    const animal = await createAnimal(db, outsider.collectionId, {
      name: 'Elsewhere',
      sex: 'female',
    });
    const moltId = randomUUID();
    await outsider.agent
      .post(`${o}/events`)
      .send({
        deviceId: 'foreign',
        clientSentAt: new Date().toISOString(),
        events: [
          {
            id: moltId,
            animalId: animal.id,
            kind: 'molted',
            payload: {},
            clientRecordedAt: new Date().toISOString(),
          },
        ],
      })
      .expect(200);
    const sac = (
      await outsider.agent
        .post(`${o}/egg-sacs`)
        .send({ femaleId: animal.id, laidOn: '2026-11-01' })
        .expect(201)
    ).body;
    const [place] = await db
      .insert(locations)
      .values({
        collectionId: outsider.collectionId,
        room: 'Far',
        rack: 'F',
        shelf: '1',
        position: '1',
      })
      .returning();
    const [note] = await db
      .insert(handoverNotes)
      .values({
        collectionId: outsider.collectionId,
        animalId: animal.id,
        text: 'Theirs',
        until: '2026-12-31',
      })
      .returning();
    const member = await signUp(ctx);
    await addMember(db, {
      collectionId: outsider.collectionId,
      userId: member.userId,
      role: 'keeper',
    });
    await outsider.agent
      .post(`${o}/covers`)
      .send({
        email: `far-${randomUUID().slice(0, 6)}@example.test`,
        firstDay: '2027-02-01',
        lastDay: '2027-02-03',
        message: '',
      })
      .expect(201);
    const [cover] = (await outsider.agent.get(`${o}/covers`).expect(200)).body.covers as {
      id: string;
    }[];
    const [theirInvite] = await db
      .insert(invites)
      .values({
        collectionId: outsider.collectionId,
        email: `theirs-${randomUUID().slice(0, 6)}@example.test`,
        role: 'keeper',
        tokenHash: randomUUID(),
        expiresAt: new Date(Date.now() + 86_400_000),
      })
      .returning();
    const colony = (
      await outsider.agent
        .post(`${o}/colonies`)
        .send({
          name: 'Their roaches',
          species: '',
          preyType: 'roach',
          sizes: ['adult'],
          intervals: { feed: 3, water_gel: 3, clean: 14, split: null },
        })
        .expect(201)
    ).body as { id: string };
    const before = (await outsider.agent.get(`${o}/backup`).expect(200)).body;

    const c = fixture.c;
    const a = animal.id;
    const mine = fixture.animalId;
    const ownPlace = await fixture.newLocation();
    const place4 = { room: 'R', rack: 'R', shelf: '1', position: '9' };
    const calls: [string, Call][] = [
      ['GET', { path: `${c}/animals/${a}` }],
      ['PUT', { path: `${c}/animals/${a}`, body: animalBody({ name: 'Mine now' }) }],
      ['GET', { path: `${c}/animals/${a}/schedule` }],
      [
        'PATCH',
        {
          path: `${c}/animals/${a}/care`,
          body: {
            intervalDays: 5,
            preyType: null,
            preySize: null,
            preyCount: null,
            hasWaterDish: true,
            doNotFeedUntil: null,
          },
        },
      ],
      [
        'POST',
        {
          path: `${c}/animals/${a}/retire`,
          body: { status: 'sold', date: '2026-12-01', note: '' },
        },
      ],
      ['POST', { path: `${c}/animals/${a}/reinstate`, body: {} }],
      ['POST', { path: `${c}/animals/${a}/relabel` }],
      ['GET', { path: `${c}/climate/animals/${a}` }],
      ['POST', { path: `${c}/animals/move`, body: { animalIds: [a], locationId: ownPlace } }],
      ['GET', { path: `${c}/animals/${a}/photo` }],
      ['PUT', { path: `${c}/animals/${a}/photo`, file: jpeg }],
      ['DELETE', { path: `${c}/animals/${a}/photo` }],
      ['GET', { path: `${c}/animals/${a}/molts/${moltId}/photo` }],
      ['PUT', { path: `${c}/animals/${a}/molts/${moltId}/photo`, file: jpeg }],
      ['PUT', { path: `${c}/animals/${mine}/molts/${moltId}/photo`, file: jpeg }],
      ['GET', { path: `${c}/animals/${a}/events/${moltId}/photo` }],
      ['PUT', { path: `${c}/animals/${a}/events/${moltId}/photo`, file: jpeg }],
      ['PUT', { path: `${c}/animals/${mine}/events/${moltId}/photo`, file: jpeg }],
      // Their collection itself, with its name typed right: not found, and still there.
      ['DELETE', { path: o, body: { confirmName: 'Test Collection' } }],
      ['PATCH', { path: `${c}/locations/${place!.id}`, body: place4 }],
      ['DELETE', { path: `${c}/locations/${place!.id}` }],
      [
        'POST',
        { path: `${c}/handover/notes`, body: { animalId: a, text: 'Sneaky', until: '2026-12-31' } },
      ],
      ['DELETE', { path: `${c}/handover/notes/${note!.id}` }],
      [
        'POST',
        { path: `${c}/helper-reports`, body: { kind: 'escape', animalId: a, note: 'Gone' } },
      ],
      ['DELETE', { path: `${c}/members/${member.userId}` }],
      [
        'PUT',
        {
          path: `${c}/covers/${cover!.id}`,
          body: { message: 'Changed', firstDay: '2027-02-01', lastDay: '2027-02-09' },
        },
      ],
      ['POST', { path: `${c}/covers/${cover!.id}/end` }],
      ['POST', { path: `${c}/covers/${cover!.id}/resend` }],
      ['POST', { path: `${c}/invites/${theirInvite!.id}/resend` }],
      ['DELETE', { path: `${c}/invites/${theirInvite!.id}` }],
      [
        'PUT',
        {
          path: `${c}/colonies/${colony.id}`,
          body: {
            name: 'Mine now',
            species: '',
            preyType: 'roach',
            sizes: ['adult'],
            intervals: { feed: 3, water_gel: 3, clean: 14, split: null },
          },
        },
      ],
      [
        'POST',
        {
          path: `${c}/colonies/${colony.id}/counts`,
          body: { counts: [{ preySize: 'adult', count: 0 }] },
        },
      ],
      ['GET', { path: `${c}/colonies/${colony.id}/history` }],
      // Sales — L: another collection's animal is not found for a listing or a care sheet.
      ['PUT', { path: `${c}/listings/${a}`, body: { priceMinor: 100, currency: 'CAD' } }],
      ['DELETE', { path: `${c}/listings/${a}` }],
      [
        'POST',
        { path: `${c}/listings/bulk`, body: { animalIds: [a], priceMinor: 1, currency: 'CAD' } },
      ],
      ['GET', { path: `${c}/animals/${a}/care-sheet.pdf` }],
      ['GET', { path: `${c}/animals/${a}/history.csv` }],
      ['DELETE', { path: `${c}/colonies/${colony.id}` }],
      ['POST', { path: `${c}/egg-sacs`, body: { femaleId: a, laidOn: '2026-11-02' } }],
      ['PATCH', { path: `${c}/egg-sacs/${sac.id}`, body: { eggCount: 5 } }],
      [
        'POST',
        {
          path: `${c}/egg-sacs/${sac.id}/slings`,
          body: {
            count: 2,
            namePrefix: 'Stolen',
            room: 'R',
            rack: 'R',
            shelf: '1',
            firstPosition: 1,
          },
        },
      ],
      [
        'POST',
        {
          path: `${c}/labels/pdf`,
          body: {
            animalIds: [a],
            sheet: 'a4',
            size: { widthMm: 38, heightMm: 38 },
            fields: [],
            start: 1,
            origin: 'http://localhost:3000',
          },
        },
      ],
    ];
    const seen: string[] = [];
    for (const [method, call] of calls) {
      const res = await send(owner.agent, method, call);
      if (res.status !== 404)
        seen.push(
          `${method} ${call.path}: ${res.status} ${JSON.stringify(res.body).slice(0, 160)}`,
        );
    }
    // A place of theirs in a body is a field error, as for a place that does not exist.
    const move = await owner.agent
      .post(`${c}/animals/move`)
      .send({ animalIds: [mine], locationId: place!.id })
      .expect(422);
    expect(move.body.error.message).toBe(
      'That place is not in this collection. Choose one from the list.',
    );
    // History and events: nothing of theirs comes back, and a tap on their animal is refused.
    const history = await owner.agent.get(`${c}/events?animalId=${a}`).expect(200);
    expect(history.body.events).toEqual([]);
    const tap = await owner.agent.post(`${c}/events`).send({
      deviceId: 'idor',
      clientSentAt: new Date().toISOString(),
      events: [
        {
          id: randomUUID(),
          animalId: a,
          kind: 'ate',
          payload: {},
          clientRecordedAt: new Date().toISOString(),
        },
      ],
    });
    expect(tap.body.results?.[0]?.status).toBe('rejected');
    const chore = await owner.agent.post(`${c}/chores`).send({
      clientSentAt: new Date().toISOString(),
      chores: [
        {
          id: randomUUID(),
          subjectKind: 'colony',
          subjectId: colony.id,
          kind: 'feed',
          clientRecordedAt: new Date().toISOString(),
        },
      ],
    });
    expect(chore.body.results?.[0]?.reason).toBe('unknown_subject');
    expect(
      (await outsider.agent.get(`${o}/colonies`).expect(200)).body.colonies.map(
        (x: { name: string; lastDone: { feed: string | null } }) => [x.name, x.lastDone.feed],
      ),
    ).toEqual([['Their roaches', null]]);
    expect(seen).toEqual([]);

    const after = (await outsider.agent.get(`${o}/backup`).expect(200)).body;
    expect(after).toEqual({ ...before, exportedAt: after.exportedAt });
    expect(
      (await outsider.agent.get(`${o}/members`).expect(200)).body.members.map(
        (m: { userId: string }) => m.userId,
      ),
    ).toContain(member.userId);
  });
});
