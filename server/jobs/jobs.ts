import PgBoss from 'pg-boss';
import type { CoverReportsService } from '../features/cover/cover-reports.service';
import type { RoundsService } from '../features/rounds/rounds.service';
import type { Logger } from '../logger';

export const BUILD_DUE_ROUNDS = 'build-due-rounds';
export const SEND_COVER_REPORTS = 'send-cover-reports';

/**
 * Scheduled work lives in PostgreSQL (pg-boss): a cron schedule is fired by one instance
 * only, and a job is fetched by one worker only, so several server processes never run
 * the same job twice. The round builder is also idempotent per (collection, date).
 */
export async function startJobs(options: { databaseUrl: string; rounds: RoundsService; coverReports: CoverReportsService; logger: Logger; cron?: string }) {
  const boss = new PgBoss({ connectionString: options.databaseUrl, schema: 'pgboss', max: 4 });
  boss.on('error', (err) => options.logger.error({ err }, 'job queue error'));
  await boss.start();
  await boss.createQueue(BUILD_DUE_ROUNDS);
  // Every five minutes: each collection's round is ready within minutes of its local midnight.
  await boss.schedule(BUILD_DUE_ROUNDS, options.cron ?? '*/5 * * * *', {}, { tz: 'UTC' });
  await boss.work(BUILD_DUE_ROUNDS, async () => {
    const built = await options.rounds.buildDueRounds();
    if (built.length) options.logger.info({ collections: built.length }, 'built the day’s rounds');
  });
  // Cover reports: every ten minutes, so each covered day's report goes out shortly after the
  // day ends in the collection's zone.
  await boss.createQueue(SEND_COVER_REPORTS);
  await boss.schedule(SEND_COVER_REPORTS, '*/10 * * * *', {}, { tz: 'UTC' });
  await boss.work(SEND_COVER_REPORTS, async () => {
    const sent = await options.coverReports.runDue();
    if (sent) options.logger.info({ reports: sent }, 'sent cover reports');
  });
  return {
    boss,
    stop: () => boss.stop({ graceful: true, wait: true, timeout: 10_000 }),
  };
}
