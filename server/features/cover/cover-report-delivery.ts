import type { Db } from '../../db/client';
import type { Logger } from '../../logger';
import type { Mailer } from '../../mail/mailer';
import { unsentReports, withUnsentReport } from './cover-reports.repository';

/**
 * A report the mail server did not accept is tried again on every run (every ten minutes,
 * server/jobs/jobs.ts) for a week; after that it is only in the app. A week outlasts a mail
 * provider's outage or a mistyped SMTP_URL fixed after a weekend.
 */
const RETRY_DAYS = 7;

/**
 * E-mails every report not yet accepted by the mail server, to each owner still waiting for
 * it (the lock-send-mark pattern of withUnsentReport); the number now sent to everyone.
 */
export async function deliverReports(
  db: Db,
  mailer: Mailer,
  logger: Logger | undefined,
  now: Date,
): Promise<number> {
  let sent = 0;
  for (const { id } of await unsentReports(db, new Date(now.getTime() - RETRY_DAYS * 86_400_000)))
    if (await deliverReport(db, mailer, logger, id, now)) sent += 1;
  return sent;
}

/** E-mails one report (or cover summary) to each owner still waiting for it; true when all have it. */
export async function deliverReport(
  db: Db,
  mailer: Mailer,
  logger: Logger | undefined,
  id: string,
  now: Date,
): Promise<boolean> {
  return withUnsentReport(
    db,
    id,
    async (report, owners) => {
      const sentTo = new Set(report.sentTo);
      for (const to of owners.filter((o) => !sentTo.has(o))) {
        try {
          await mailer.send({ to, subject: report.subject, text: report.body });
          sentTo.add(to);
        } catch (err) {
          logger?.warn(
            { err, reportId: report.id, collectionId: report.collectionId },
            'cover report not accepted by the mail server; retried on the next run',
          );
          return { sentTo: [...sentTo], done: false };
        }
      }
      return { sentTo: [...sentTo], done: true };
    },
    now,
  );
}
