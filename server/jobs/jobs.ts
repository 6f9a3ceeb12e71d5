import pg from 'pg';
import PgBoss from 'pg-boss';
import type { DailyMail } from '../features/climate/daily-mail';
import type { CoverReportsService } from '../features/cover/cover-reports.service';
import type { HelperReportsService } from '../features/helper-reports/helper-reports.service';
import type { RoundsService } from '../features/rounds/rounds.service';
import type { SalesService } from '../features/sales/sales.service';
import type { Logger } from '../logger';

export const BUILD_DUE_ROUNDS = 'build-due-rounds';
export const SEND_COVER_REPORTS = 'send-cover-reports';
export const SEND_DAILY_MAILS = 'send-daily-mails';
export const EXPIRE_RESERVATIONS = 'expire-reservations';

/**
 * Scheduled work lives in PostgreSQL (pg-boss): a cron schedule is fired by one instance
 * only, and a job is fetched by one worker only, so several server processes never run
 * the same job twice. The round builder is also idempotent per (collection, date).
 */
export async function startJobs(options: {
  databaseUrl: string;
  rounds: RoundsService;
  coverReports: CoverReportsService;
  /** Helpers' reports the mail server refused at first go out again with the cover reports. */
  helperReports?: Pick<HelperReportsService, 'deliverDue'>;
  /** The owners' morning e-mail (rooms out of range), from 07:00 in each collection's zone. */
  dailyMail?: Pick<DailyMail, 'runDue'>;
  /** Sales — S: reservations whose hold ended before the collection's today, nothing paid. */
  sales?: Pick<SalesService, 'expireReservations'>;
  logger: Logger;
  cron?: string;
}) {
  const boss = new PgBoss({ connectionString: options.databaseUrl, schema: 'pgboss', max: 4 });
  boss.on('error', (err) => options.logger.error({ err }, 'job queue error'));
  // Processes starting together would deadlock creating the same queues (seen in
  // tests/api/production.test.ts): one at a time sets them up, under an advisory lock.
  await oneAtATime(options.databaseUrl, async () => {
    await boss.start();
    await boss.createQueue(BUILD_DUE_ROUNDS);
    await boss.createQueue(SEND_COVER_REPORTS);
    await boss.createQueue(SEND_DAILY_MAILS);
    await boss.createQueue(EXPIRE_RESERVATIONS);
    // Every five minutes: each collection's round is ready within minutes of its local midnight.
    await boss.schedule(BUILD_DUE_ROUNDS, options.cron ?? '*/5 * * * *', {}, { tz: 'UTC' });
    // Cover reports: every ten minutes, so each covered day's report goes out shortly after
    // the day ends in the collection's zone.
    await boss.schedule(SEND_COVER_REPORTS, '*/10 * * * *', {}, { tz: 'UTC' });
    // The morning e-mail: every quarter hour, so each collection's goes out soon after its 07:00
    // (zones differ by quarter hours at most); sent once per owner and day whatever the runs.
    await boss.schedule(SEND_DAILY_MAILS, '*/15 * * * *', {}, { tz: 'UTC' });
    // Holds end at a collection's local midnight: every quarter hour releases them soon after.
    await boss.schedule(EXPIRE_RESERVATIONS, '*/15 * * * *', {}, { tz: 'UTC' });
  });
  await boss.work(BUILD_DUE_ROUNDS, async ([job]) => {
    await buildDueRoundsJob(options.rounds, options.logger, job?.id);
  });
  await boss.work(SEND_COVER_REPORTS, async ([job]) => {
    const sent = await options.coverReports.runDue();
    const helperSent = (await options.helperReports?.deliverDue()) ?? 0;
    options.logger.info(
      { queue: SEND_COVER_REPORTS, jobId: job?.id, reports: sent, helperReports: helperSent },
      'job done',
    );
  });
  await boss.work(SEND_DAILY_MAILS, async ([job]) => {
    const sent = (await options.dailyMail?.runDue()) ?? 0;
    options.logger.info({ queue: SEND_DAILY_MAILS, jobId: job?.id, mails: sent }, 'job done');
  });
  await boss.work(EXPIRE_RESERVATIONS, async ([job]) => {
    const expired = (await options.sales?.expireReservations()) ?? 0;
    options.logger.info({ queue: EXPIRE_RESERVATIONS, jobId: job?.id, expired }, 'job done');
  });
  return {
    boss,
    stop: () => boss.stop({ graceful: true, wait: true, timeout: 10_000 }),
  };
}

/** The round job's work: a collection whose round cannot be built is logged with its id, and the rest are built. */
export async function buildDueRoundsJob(
  rounds: Pick<RoundsService, 'buildDueRounds'>,
  logger: Logger,
  jobId?: string,
) {
  let failed = 0;
  const built = await rounds.buildDueRounds((collectionId, err) => {
    failed++;
    logger.error(
      { err, queue: BUILD_DUE_ROUNDS, jobId, collectionId },
      'round build failed for one collection',
    );
  });
  logger.info({ queue: BUILD_DUE_ROUNDS, jobId, collections: built.length, failed }, 'job done');
  return { built, failed };
}

const SETUP_LOCK = 7_205_118; // any constant shared by every Rackside process

async function oneAtATime(databaseUrl: string, work: () => Promise<void>) {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    await client.query('select pg_advisory_lock($1)', [SETUP_LOCK]);
    await work();
  } finally {
    await client.query('select pg_advisory_unlock($1)', [SETUP_LOCK]).catch(() => undefined);
    await client.end();
  }
}
