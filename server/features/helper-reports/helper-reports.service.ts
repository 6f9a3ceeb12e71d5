import type { HelperReportBody, HelperReportView } from '#shared/schemas/helper-reports';
import type { MemberCollection } from '../../access/memberships';
import type { Background } from '../../background';
import type { Db } from '../../db/client';
import type { Logger } from '../../logger';
import type { Mailer } from '../../mail/mailer';
import { HttpError } from '../../middleware/errors';
import { helperReportMail } from './helper-report-mail';
import {
  animalInCollection,
  insertHelperReport,
  reportsSince,
  unsentHelperReports,
  withUnsentHelperReport,
} from './helper-reports.repository';

interface Deps {
  mailer: Mailer;
  now: () => Date;
  publicUrl: (path: string) => string;
  background: Background;
  logger?: Logger;
}

/** The owners' page lists a month of reports: enough to look back over a holiday's cover. */
const LIST_DAYS = 31;
/** A report the mail server refused is tried again on each cover-report run for two days. */
const RETRY_MS = 2 * 86_400_000;
/** Younger reports are still with their own request's background send. */
const SETTLE_MS = 60_000;

/** A helper's reports: stored at once, then e-mailed to every owner after the answer. */
export function createHelperReportsService(db: Db, deps: Deps) {
  /** E-mails the report to each owner not yet sent it; a refusal leaves it in the app only. */
  async function deliver(id: string) {
    return withUnsentHelperReport(
      db,
      id,
      async (report, owners) => {
        const sentTo = new Set(report.sentTo);
        const mail = helperReportMail(report, deps.publicUrl('/cover'));
        for (const to of owners.filter((o) => !sentTo.has(o))) {
          try {
            await deps.mailer.send({ to, ...mail });
            sentTo.add(to);
          } catch (err) {
            deps.logger?.warn(
              { err, reportId: id },
              'helper report not accepted by the mail server',
            );
            return { sentTo: [...sentTo], done: false };
          }
        }
        return { sentTo: [...sentTo], done: true };
      },
      deps.now(),
    );
  }

  return {
    async report(c: MemberCollection, userId: string, body: HelperReportBody) {
      if (body.animalId && !(await animalInCollection(db, c.collectionId, body.animalId)))
        throw new HttpError(404, 'not_found', 'We could not find that animal in this collection.');
      const id = await insertHelperReport(db, {
        collectionId: c.collectionId,
        kind: body.kind,
        animalId: body.animalId,
        animalText: body.animalId ? '' : body.animalText,
        note: body.note,
        reportedBy: userId,
        createdAt: deps.now(),
      });
      deps.background.run('helper-report-mail', async () => {
        await deliver(id);
      });
      return { id };
    },

    /** Sends what an earlier try could not (a mail server outage); how many are now sent. */
    async deliverDue(): Promise<number> {
      const now = deps.now().getTime();
      let sent = 0;
      for (const { id } of await unsentHelperReports(
        db,
        new Date(now - RETRY_MS),
        new Date(now - SETTLE_MS),
      ))
        if (await deliver(id)) sent += 1;
      return sent;
    },

    async list(collectionId: string): Promise<HelperReportView[]> {
      return viewsOf(
        await reportsSince(
          db,
          collectionId,
          new Date(deps.now().getTime() - LIST_DAYS * 86_400_000),
        ),
      );
    },

    /** The reports made in [from, to), newest first: a cover's summary lists them. */
    async between(collectionId: string, from: Date, to: Date): Promise<HelperReportView[]> {
      return viewsOf(await reportsSince(db, collectionId, from, to));
    },
  };
}

function viewsOf(rows: Awaited<ReturnType<typeof reportsSince>>): HelperReportView[] {
  return rows.map((r) => ({
    id: r.id,
    kind: r.kind,
    animal:
      r.animalId && r.animalName && r.labelCode
        ? { id: r.animalId, name: r.animalName, labelCode: r.labelCode }
        : null,
    animalText: r.animalText,
    note: r.note,
    reportedBy: r.reportedBy ?? 'A former helper',
    createdAt: r.createdAt.toISOString(),
  }));
}
export type HelperReportsService = ReturnType<typeof createHelperReportsService>;
