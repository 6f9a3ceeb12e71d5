import path from 'node:path';
import compression from 'compression';
import express from 'express';
import { localDateOf } from '#shared/domain/local-dates';
import type { Role } from '#shared/domain/roles';
import { createBackground } from './background';
import type { Database } from './db/client';
import type { Env } from './env';
import { animalsRoutes } from './features/animals/animals.routes';
import { createAnimalsService } from './features/animals/animals.service';
import { authRoutes, DEFAULT_AUTH_LIMITS, type AuthLimits } from './features/auth/auth.routes';
import { createAuthService } from './features/auth/auth.service';
import {
  availabilityRoutes,
  publicAvailabilityRoutes,
} from './features/availability/availability.routes';
import { createAvailabilityService } from './features/availability/availability.service';
import { breedingRoutes } from './features/breeding/breeding.routes';
import { createBreedingService } from './features/breeding/breeding.service';
import { careSheetsRoutes } from './features/care-sheets/care-sheets.routes';
import { createCareSheetsService } from './features/care-sheets/care-sheets.service';
import { choresRoutes } from './features/chores/chores.routes';
import { createChoresService } from './features/chores/chores.service';
import { climateRoutes } from './features/climate/climate.routes';
import { createClimateService } from './features/climate/climate.service';
import { createDailyMail } from './features/climate/daily-mail';
import { collectionsRoutes } from './features/collections/collections.routes';
import { createCollectionsService } from './features/collections/collections.service';
import { myCollectionsRoutes } from './features/collections/my-collections.routes';
import { coloniesRoutes } from './features/colonies/colonies.routes';
import { createColoniesService } from './features/colonies/colonies.service';
import { createCoverReportsService } from './features/cover/cover-reports.service';
import { coverInviteRoutes, coverRoutes } from './features/cover/cover.routes';
import { createCoverService } from './features/cover/cover.service';
import { dataRoutes, LARGE_BODY_PATHS } from './features/data/data.routes';
import { createDataService } from './features/data/data.service';
import { devRoutes } from './features/dev/dev.routes';
import { eventsRoutes, syncFastPath } from './features/events/events.routes';
import { createEventsService } from './features/events/events.service';
import { healthRoutes } from './features/health/health.routes';
import { helperReportsRoutes } from './features/helper-reports/helper-reports.routes';
import { createHelperReportsService } from './features/helper-reports/helper-reports.service';
import { labelsRoutes } from './features/labels/labels.routes';
import { createLabelsService } from './features/labels/labels.service';
import { lanRoutes } from './features/lan/lan.routes';
import { listingsRoutes } from './features/listings/listings.routes';
import { createListingsService } from './features/listings/listings.service';
import { locationsRoutes } from './features/locations/locations.routes';
import { createLocationsService } from './features/locations/locations.service';
import type { PaymentConfig } from './features/payments/payment-config';
import { paymentsRoutes, paymentsWebhookRoutes } from './features/payments/payments.routes';
import { createPaymentsService } from './features/payments/payments.service';
import { photosRoutes } from './features/photos/photos.routes';
import { createPhotosService } from './features/photos/photos.service';
import {
  animalScheduleRoutes,
  prepListRoutes,
  roundsRoutes,
  todayRoundFastPath,
} from './features/rounds/rounds.routes';
import { createRoundsService } from './features/rounds/rounds.service';
import { rulesRoutes } from './features/rounds/rules.routes';
import { animalsToReconcile } from './features/rounds/urgent-tasks';
import { salesRoutes } from './features/sales/sales.routes';
import { createSalesService } from './features/sales/sales.service';
import type { LanInfo } from './lan/lan-server';
import { createLogger, type Logger } from './logger';
import type { DevMailbox } from './mail/dev-smtp';
import type { Mailer } from './mail/mailer';
import { requireUser } from './middleware/auth';
import { requireSameSiteWrite } from './middleware/csrf';
import { apiNotFound, errorHandler, HttpError } from './middleware/errors';
import { createLimiter } from './middleware/rate-limit';
import { requireMember } from './middleware/roles';
import { sessionMemberCheck } from './middleware/session-member';
import { repoRoot } from './repo-root';
import { requestLog } from './request-log';
import { securityHeaders } from './security-headers';
import { createSessionStore, SESSION_COOKIE, sessions } from './sessions';
import { serveClient } from './static';

const defaultDist = path.join(repoRoot(), 'dist');

export interface AppOptions {
  env: Env;
  database: Database;
  mailer: Mailer;
  devMailbox?: DevMailbox;
  now?: () => Date;
  authLimits?: Partial<AuthLimits>;
  distDir?: string;
  logger?: Logger;
  /** Base URL for links in e-mails; defaults to PUBLIC_URL or the request's own origin. */
  publicUrl?: string;
  /** LAN mode (`npm start -- --lan`): the address and certificate phones use. */
  lan?: LanInfo;
  /** Sales — payments: the card payment service's keys (or the local fake's); none: card off. */
  payments?: PaymentConfig;
}

export function createApp(options: AppOptions) {
  const { env, database } = options;
  const now = options.now ?? (() => new Date());
  const logger = options.logger ?? createLogger(env);
  const app = express();
  app.disable('x-powered-by');
  if (env.TRUST_PROXY) {
    const n = Number(env.TRUST_PROXY);
    app.set('trust proxy', Number.isInteger(n) ? n : env.TRUST_PROXY);
  }

  app.use(securityHeaders());
  // gzip for the app's JavaScript, CSS and JSON: a first visit over a slow mobile link moves
  // about a third of the bytes (P3). Today's round arrives already gzipped from its cache.
  app.use(compression());
  app.use(requestLog(logger));

  const store = createSessionStore(database.pool, env, now);

  const api = express.Router();
  const rounds = createRoundsService(database.db, now);
  // Today's round, the hot read, skips the session middleware when its one-query check passes.
  const sessionMember = sessionMemberCheck(database.pool, env.SESSION_SECRET, store, now);
  api.use(todayRoundFastPath(rounds, sessionMember));
  // Sales — payments: the service's webhook is checked against its raw bytes, and carries no
  // session and no app header, so it sits before the JSON parser, the sessions and CSRF check.
  const payments = createPaymentsService(database.db, {
    now,
    config: options.payments,
    publicBase: options.publicUrl ?? env.PUBLIC_URL ?? options.lan?.url,
    logger,
  });
  api.use('/payments/webhook', paymentsWebhookRoutes(payments));
  // Imports and restores may be large: their routes parse them after the membership check.
  api.use(
    express.json({
      limit: '1mb',
      type: (req) =>
        !LARGE_BODY_PATHS.test(req.url ?? '') && /json/i.test(req.headers['content-type'] ?? ''),
    }),
  );
  // A sync batch, like today's round, skips the session middleware when its one-query check
  // passes (its route is added once the events service exists, below).
  const syncFast = express.Router();
  api.use(syncFast);
  api.use(sessions(env, store));
  api.use(requireSameSiteWrite);

  const publicUrl = (p: string) =>
    `${options.publicUrl ?? env.PUBLIC_URL ?? options.lan?.url ?? `http://localhost:${env.PORT}`}${p}`;
  const background = createBackground(logger);
  const auth = createAuthService({
    db: database.db,
    mailer: options.mailer,
    now,
    bcryptCost: env.BCRYPT_COST,
    publicUrl,
    background,
  });
  const helperReports = createHelperReportsService(database.db, {
    mailer: options.mailer,
    now,
    publicUrl,
    background,
    logger,
  });
  const cover = createCoverService(database.db, {
    mailer: options.mailer,
    now,
    bcryptCost: env.BCRYPT_COST,
    publicUrl,
    background,
    logger,
    problemsBetween: helperReports.between,
  });
  const member = (min: Role, options?: { anyTime?: boolean }) =>
    requireMember(database.db, min, now, options);

  api.use('/health', healthRoutes(database.pool));
  api.use('/lan', lanRoutes(options.lan));
  const limiter = createLimiter(database.pool);
  const limits = { ...DEFAULT_AUTH_LIMITS, ...options.authLimits };
  api.use('/auth', authRoutes(auth, limits, SESSION_COOKIE, limiter));
  // Cover and keeper invites share one daily budget per collection; refused requests (a bad
  // body, someone already a member) do not use it up.
  const inviteLimit = limiter('collection-invites', {
    windowMs: 24 * 60 * 60_000,
    limit: limits.invitesPerCollection,
    keyGenerator: (req) => String(req.params.collectionId),
    skipFailedRequests: true,
    handler: (_req, _res, next) =>
      next(
        new HttpError(
          429,
          'rate_limited',
          `This collection has sent ${limits.invitesPerCollection} invites today. More can go tomorrow.`,
        ),
      ),
  });
  // The demo's hints with DEMO_MODE; the local mailbox when the SMTP fake runs, never in production.
  const devMailbox = env.NODE_ENV === 'production' ? undefined : options.devMailbox;
  api.use('/dev', devRoutes(devMailbox, auth, { demo: env.DEMO_MODE }));
  api.use(
    '/cover-invites',
    coverInviteRoutes(
      cover,
      auth,
      limiter('invite-ip', {
        windowMs: 15 * 60_000,
        limit: options.authLimits?.signInPerIp ?? DEFAULT_AUTH_LIMITS.signInPerIp,
      }),
    ),
  );

  // A status change meets the animal's sale first (sales, created below, answers by then).
  const animals = createAnimalsService(database.db, now, (tx, collectionId, animalId, change) =>
    sales.animalStatusChanging(tx, collectionId, animalId, change),
  );
  // Feeder colonies and their care (chores): neither feature knows the other, nor rounds.
  const colonies = createColoniesService(database.db, {
    now,
    lastDone: (c, ids) => chores.lastDone(c, 'colony', ids),
    forgetChores: (collectionId, id) => chores.forget(collectionId, 'colony', id),
    offersOn: rounds.offersOn,
    feedersOf: async (collectionId) => (await rounds.rules(collectionId)).rules.feeders,
  });
  const climate = createClimateService(database.db, now);
  // Chores know none of their subjects: colonies and rooms bring their look-ups, and a room's
  // chore becomes its typed climate reading in the chore's own transaction (decision 020).
  const chores = createChoresService(database.db, {
    now,
    subjects: { colony: colonies.colonyIdsIn, room: climate.roomsIn },
    onStored: { room: climate.storeTypedReadings },
  });
  const events = createEventsService(database.db, {
    now,
    feedHolds: rounds.feedHolds,
    // Facts that start or lift a hold, or leave prey with a molting animal, change today's
    // round at once (R18): the events feature knows nothing of rounds.
    onRecorded: [
      (c, recorded, batch) =>
        rounds.reconcileToday(
          c.collectionId,
          animalsToReconcile(recorded, c.timeZone, localDateOf(now(), c.timeZone)),
          batch,
        ),
      // Meals and prey left in take from the feeder colonies; an undo puts them back. The
      // events are stored already: a failure here is logged, never a failed sync (the phone
      // would re-send, and a duplicate runs no hook).
      (c, recorded) =>
        colonies
          .takeUsed(c, recorded)
          .catch((err: unknown) => logger.error({ err }, 'Feeder colony stock not updated')),
    ],
  });
  syncFast.use(syncFastPath(events, sessionMember));
  const photos = createPhotosService(database.db, path.resolve(env.STORAGE_DIR), now);
  const coverReports = createCoverReportsService(database.db, {
    mailer: options.mailer,
    now,
    rounds,
    publicUrl,
    logger,
    summaries: cover.summaries,
  });
  // A breeding record's facts may start or end a hold today (R18).
  const breeding = createBreedingService(database.db, now, (id, animalIds) =>
    rounds.reconcileToday(id, animalIds),
  );
  const collections = createCollectionsService(database.db, {
    mailer: options.mailer,
    now,
    publicUrl,
    background,
    removeFiles: photos.removeCollection,
  });
  api.use('/collections', myCollectionsRoutes(auth, collections));

  // Sales — listings, availability, care sheets (L). The availability list is public: no
  // session, its own link, a per-address budget.
  const listings = createListingsService(database.db, now);
  const availability = createAvailabilityService(database.db, { now, listings });
  const careSheets = createCareSheetsService(database.db, {
    now,
    rules: async (collectionId) => (await rounds.rules(collectionId)).rules,
    listings,
  });
  api.use(
    '/available',
    publicAvailabilityRoutes(
      availability,
      limiter('available-ip', { windowMs: 60_000, limit: 60 }),
    ),
  );

  // Everything under a collection: signed in first, then each route's own membership check.
  const collection = (p = '') => `/collections/:collectionId${p}`;
  api.use(collection(), requireUser);
  // Routers that serve several paths of their own under the collection:
  //   data: /export/animals.csv, /export/events.csv, /animals/import, /backup, /restore
  api.use(
    collection(),
    dataRoutes(createDataService(database.db, { animals, photos, now }), member),
  );
  api.use(collection('/animals'), animalsRoutes(animals, member));
  api.use(
    collection('/animals/:animalId'),
    animalScheduleRoutes(rounds, animals.updateCare, member),
  );
  const dailyMail = createDailyMail(database.db, {
    mailer: options.mailer,
    now,
    publicUrl,
    logger,
  });
  // A room renamed with its places keeps its climate targets and readings. Its reading chores
  // keep the name they were made with: a phone re-sending one stays a duplicate.
  api.use(
    collection('/locations'),
    locationsRoutes(
      createLocationsService(database.db, { onRoomRenamed: climate.renameRoom }),
      member,
    ),
  );
  //   climate: /climate/today, /climate/rooms, /climate/targets,
  //            /climate/history, /climate/import, /climate/animals/:animalId
  api.use(collection('/climate'), climateRoutes(climate, member));
  api.use(collection('/rounds'), roundsRoutes(rounds, member));
  api.use(collection('/prep-list'), prepListRoutes(rounds, member));
  api.use(collection('/rules'), rulesRoutes(rounds, member));
  api.use(collection('/events'), eventsRoutes(events, member));
  api.use(collection('/colonies'), coloniesRoutes(colonies, member));
  api.use(collection('/chores'), choresRoutes(chores, member));
  //   photos: /animals/:animalId/photo, /animals/:animalId/molts/:eventId/photo,
  //           /animals/:animalId/events/:eventId/photo
  api.use(collection(), photosRoutes(photos, member));
  //   cover: /covers…, /handover…, /cover-reports, /cover/mine…
  api.use(collection(), coverRoutes(cover, coverReports, rounds, member, inviteLimit));
  api.use(collection('/helper-reports'), helperReportsRoutes(helperReports, member));
  //   breeding: /egg-sacs…, /incubation
  api.use(collection(), breedingRoutes(breeding, member));
  //   labels: /labels/pdf, /animals/:animalId/relabel
  api.use(collection(), labelsRoutes(createLabelsService(database.db), member));
  // Sales — payments: /invoices/:invoiceId/checkout, /invoices/:invoiceId/payments,
  //                   /invoices/:invoiceId/refund
  api.use(collection(), paymentsRoutes(payments, member));
  // Sales — S: settings, buyers, reservations, invoices, shipping (owners and keepers only).
  //   sales: /sales-settings, /buyers…, /sales…, /invoices/:invoiceId…, /animals/:animalId/sale
  const sales = createSalesService(database.db, {
    now,
    mailer: options.mailer,
    background,
    logger,
    retireAsSold: (tx, c, animalId, userId, body) =>
      animals.setStatusIn(tx, c, animalId, userId, body),
    careSheetPdf: (c, animalId) => careSheets.pdf(c, animalId),
    closeCheckout: (collectionId, invoiceId) => payments.expireCheckout(collectionId, invoiceId),
    paymentLink: (collectionId, invoiceId) =>
      payments.paymentLink(collectionId, invoiceId, publicUrl('')),
  });
  api.use(collection(), salesRoutes(sales, member));
  //   collections: the collection itself (/), /members…, /invites…, /membership
  api.use(collection(), collectionsRoutes(collections, member, inviteLimit));
  // Sales — listings, availability, care sheets (L)
  api.use(collection('/listings'), listingsRoutes(listings, member));
  api.use(collection('/availability'), availabilityRoutes(availability, member));
  //   care sheets: /animals/:animalId/care-sheet.pdf, /animals/:animalId/history.csv
  api.use(collection('/animals/:animalId'), careSheetsRoutes(careSheets, member));
  api.use(apiNotFound);
  api.use(errorHandler);
  app.use('/api', api);

  serveClient(app, options.distDir ?? defaultDist);
  app.use(errorHandler);

  return {
    app,
    services: {
      rounds,
      events,
      colonies,
      coverReports,
      helperReports,
      background,
      climate,
      dailyMail,
      // Sales — L: the ship e-mail attaches care sheets.
      careSheets,
      // Sales — payments: expireCheckout for a cancelled invoice.
      payments,
      sales,
    },
    async shutdown() {
      // Mail a request started goes out before the database and the mailer close.
      await background.drain();
      await new Promise<void>((resolve) => (store.close ? (store.close(), resolve()) : resolve()));
    },
  };
}
