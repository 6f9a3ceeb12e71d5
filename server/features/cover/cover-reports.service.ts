import { addDays, localDateOf, startOfLocalDate, type LocalDate } from '#shared/domain/local-dates';
import type { Db } from '../../db/client';
import type { Logger } from '../../logger';
import type { Mailer } from '../../mail/mailer';
import type { RoundsService } from '../rounds/rounds.service';
import { deliverReports } from './cover-report-delivery';
import { createReportText, type CoverDays } from './cover-report-text';
import {
  claimReport,
  coversSince,
  latestReports,
  writeReport,
  type ReportCollection,
} from './cover-reports.repository';
import type { CoverSummaries } from './cover-summary';

/** Reports are made for days that ended in the last three days (a server that was down catches up). */
const CATCH_UP_DAYS = 3;

interface Deps {
  mailer: Mailer;
  now: () => Date;
  rounds: RoundsService;
  publicUrl: (path: string) => string;
  logger?: Logger;
  /** Covers that ended by themselves get their summary on the same run (cover-summary.ts). */
  summaries?: Pick<CoverSummaries, 'makeDue'>;
}

export interface CoverReportView {
  id: string;
  coverId: string | null;
  localDate: string;
  subject: string;
  body: string;
  createdAt: string;
}

/**
 * After each covered day ends in the collection's own time zone (a 23- or 25-hour day across
 * daylight-saving changes too), one report: what was fed, refused, skipped and noted, and what
 * needs attention; on the cover's last day, a summary of the whole cover. E-mailed to the owners
 * and kept for the app. One row per (collection, day) makes it exactly once across processes.
 */
export function createCoverReportsService(db: Db, deps: Deps) {
  const reportFor = createReportText(db, deps);

  /** Writes each covered day's report once it has ended; true for the (collection, day) this run made. */
  async function make(
    c: ReportCollection,
    day: LocalDate,
    cover: CoverDays,
    now: Date,
  ): Promise<boolean> {
    // Claimed and written in one transaction: a failed build leaves no empty claim behind.
    return db.transaction(async (tx) => {
      // Made "now" on the app's clock, which also bounds its retries (deliverReports).
      const id = await claimReport(tx, c.id, day, now);
      if (!id) return false;
      await writeReport(tx, id, await reportFor(c, day, cover));
      return true;
    });
  }

  return {
    /**
     * Makes a report for every covered day that has ended and a summary for every cover that
     * has, then e-mails every report the mail server has not yet accepted (this run's and earlier failures). Safe to run as often as
     * wanted; returns how many reports were sent.
     */
    async runDue(): Promise<number> {
      const now = deps.now();
      const earliest = new Date(now.getTime() - (CATCH_UP_DAYS + 1) * 86_400_000);
      for (const { c, startsAt, endsAt } of await coversSince(db, now, earliest)) {
        const firstDay = localDateOf(startsAt!, c.timeZone);
        const lastDay = localDateOf(new Date(endsAt!.getTime() - 1), c.timeZone);
        for (let day = firstDay; day <= lastDay; day = addDays(day, 1)) {
          const dayEnd = startOfLocalDate(addDays(day, 1), c.timeZone);
          if (dayEnd > now || dayEnd < earliest) continue;
          // A cover ended early reports its last (partial) day as its last day.
          try {
            await make(c, day, { firstDay, lastDay }, now);
          } catch (err) {
            // One collection's failure does not hold back the others' reports; the next run retries it.
            deps.logger?.error(
              { err, collectionId: c.id, localDate: day },
              'cover report could not be made',
            );
          }
        }
      }
      await deps.summaries?.makeDue();
      return deliverReports(db, deps.mailer, deps.logger, now);
    },

    async list(collectionId: string): Promise<CoverReportView[]> {
      const rows = await latestReports(db, collectionId);
      return rows
        .filter((r) => r.subject)
        .map((r) => ({
          id: r.id,
          coverId: r.coverId,
          localDate: r.localDate,
          subject: r.subject,
          body: r.body,
          createdAt: r.createdAt.toISOString(),
        }));
    },
  };
}
export type CoverReportsService = ReturnType<typeof createCoverReportsService>;
