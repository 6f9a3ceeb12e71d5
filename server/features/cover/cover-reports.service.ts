import { and, asc, desc, eq, gte, isNotNull, lt, sql } from 'drizzle-orm';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import { EVENT_WORDS, type EventKind } from '../../../shared/domain/event-kinds';
import { addDays, clockTime, describeLocalDate, localDateOf, startOfLocalDate, type LocalDate } from '../../../shared/domain/local-dates';
import type { AnimalState } from '../../../shared/domain/rounds/animal-state';
import { countsForProgress } from '../../../shared/domain/rounds/settle';
import { animals, events } from '../../db/schema/animals';
import { collections, coverReports, memberships } from '../../db/schema/collections';
import { animalStates } from '../../db/schema/rounds';
import { users } from '../../db/schema/users';
import type { Logger } from '../../logger';
import type { Mailer } from '../../mail/mailer';
import type { RoundsService } from '../rounds/rounds.service';
import { unsentReports, withUnsentReport } from './cover-reports.repository';

/** Reports are made for days that ended in the last three days (a server that was down catches up). */
const CATCH_UP_DAYS = 3;
/**
 * A report the mail server did not accept is tried again on every run (every ten minutes,
 * server/jobs/jobs.ts) for a week; after that it is only in the app. A week outlasts a mail
 * provider's outage or a mistyped SMTP_URL fixed after a weekend.
 */
const RETRY_DAYS = 7;

interface Deps {
  mailer: Mailer;
  now: () => Date;
  rounds: RoundsService;
  publicUrl: (path: string) => string;
  logger?: Logger;
}

export interface CoverReportView {
  localDate: string;
  subject: string;
  body: string;
  createdAt: string;
}

type Collection = typeof collections.$inferSelect;

/**
 * After each covered day ends in the collection's own time zone (a 23- or 25-hour day across
 * daylight-saving changes too), one report: what was fed, refused, skipped and noted, and what
 * needs attention; on the cover's last day, a summary of the whole cover. E-mailed to the owners
 * and kept for the app. One row per (collection, day) makes it exactly once across processes.
 */
export function createCoverReportsService(db: NodePgDatabase, deps: Deps) {
  async function dayFacts(c: Collection, from: Date, to: Date) {
    const rows = await db
      .select({ id: events.id, kind: events.kind, payload: events.payload, at: events.effectiveAt, animal: animals.name, code: animals.labelCode, by: users.displayName })
      .from(events)
      .innerJoin(animals, eq(animals.id, events.animalId))
      .leftJoin(users, eq(users.id, events.recordedBy))
      .where(and(eq(events.collectionId, c.id), gte(events.effectiveAt, from), lt(events.effectiveAt, to)))
      .orderBy(asc(events.effectiveAt));
    const voided = new Set(rows.filter((r) => r.kind === 'void').map((r) => (r.payload as { targetId?: string }).targetId));
    return rows.filter((r) => r.kind !== 'void' && !voided.has(r.id));
  }

  async function build(c: Collection, day: LocalDate, cover: { firstDay: LocalDate; lastDay: LocalDate }) {
    const facts = await dayFacts(c, startOfLocalDate(day, c.timeZone), startOfLocalDate(addDays(day, 1), c.timeZone));
    const line = (f: (typeof facts)[number]) => {
      const p = f.payload as { text?: string; note?: string };
      const detail = p.text ?? p.note;
      return `- ${clockTime(f.at.toISOString(), c.timeZone)} ${f.animal} (${f.code})${f.by ? ` by ${f.by}` : ''}${detail ? `: ${detail}` : ''}`;
    };
    const section = (title: string, kinds: EventKind[]) => {
      const list = facts.filter((f) => kinds.includes(f.kind as EventKind));
      return list.length ? [`${title} (${list.length})`, ...list.map(line), ''] : [];
    };
    const others = facts.filter((f) => !['ate', 'refused', 'skipped', 'note'].includes(f.kind));

    const round = await deps.rounds.round(c.id, day);
    const missed = round.items.filter((i) => i.tasks.some((t) => countsForProgress(t.kind) && !t.done));
    const twice = round.items.filter((i) => i.warnings.length > 0);
    const states = await db
      .select({ name: animals.name, code: animals.labelCode, state: animalStates.state })
      .from(animalStates)
      .innerJoin(animals, eq(animals.id, animalStates.animalId))
      .where(and(eq(animalStates.collectionId, c.id), eq(animals.status, 'active')));
    const streaks = states.filter((s) => (s.state as AnimalState).refusalStreak >= 2);
    const preyIn = states.filter((s) => (s.state as AnimalState).preyLeftIn !== null);
    const attention = [
      ...missed.map((i) => `- Not done: ${i.animal.name} (${i.animal.labelCode}) — ${i.tasks.filter((t) => countsForProgress(t.kind) && !t.done).map((t) => t.kind.replace('_', ' ')).join(', ')}`),
      ...streaks.map((s) => `- Refused ${(s.state as AnimalState).refusalStreak} times in a row: ${s.name} (${s.code}) — possible premolt`),
      ...preyIn.map((s) => `- Prey still inside: ${s.name} (${s.code}) since ${describeLocalDate((s.state as AnimalState).preyLeftIn!.since)}`),
      ...twice.map((i) => `- ${i.animal.name} (${i.animal.labelCode}): ${i.warnings.join(' ')}`),
    ];

    const last = day === cover.lastDay;
    const summary: string[] = [];
    if (last) {
      const all = await dayFacts(c, startOfLocalDate(cover.firstDay, c.timeZone), startOfLocalDate(addDays(cover.lastDay, 1), c.timeZone));
      const counts = new Map<string, number>();
      for (const f of all) counts.set(f.kind, (counts.get(f.kind) ?? 0) + 1);
      summary.push(
        `The cover is over: ${describeLocalDate(cover.firstDay, true)} to ${describeLocalDate(cover.lastDay, true)}.`,
        ...[...counts.entries()].map(([k, n]) => `- ${EVENT_WORDS[k as EventKind] ?? k}: ${n}`),
        '',
      );
    }
    const subject = `${c.name}: cover report for ${describeLocalDate(day, true)}${last ? ' (last day)' : ''}`;
    const body = [
      `${c.name} — ${describeLocalDate(day, true)}`,
      '',
      ...(facts.length ? [] : ['Nothing was recorded this day.', '']),
      ...section('Fed', ['ate']),
      ...section('Refused', ['refused']),
      ...section('Skipped', ['skipped']),
      ...section('Notes', ['note']),
      ...(others.length ? [`Also recorded (${others.length})`, ...others.map((f) => `${line(f)} — ${EVENT_WORDS[f.kind as EventKind] ?? f.kind}`), ''] : []),
      ...(attention.length ? ['Needs attention', ...attention, ''] : ['Nothing needs attention.', '']),
      ...summary,
      `Today's round and history: ${deps.publicUrl('/today')}`,
    ].join('\n');
    return { subject, body };
  }

  /** Writes each covered day's report once it has ended; true for the (collection, day) this run made. */
  async function make(c: Collection, day: LocalDate, cover: { firstDay: LocalDate; lastDay: LocalDate }, now: Date): Promise<boolean> {
    // Claimed and written in one transaction: a failed build leaves no empty claim behind, and
    // another process claiming the same day waits on the unique key, then finds it taken.
    return db.transaction(async (tx) => {
      // Made "now" on the app's clock, which also bounds its retries (deliver).
      const claimed = await tx.insert(coverReports).values({ collectionId: c.id, localDate: day, subject: '', body: '', createdAt: now }).onConflictDoNothing().returning({ id: coverReports.id });
      if (!claimed.length) return false;
      await tx.update(coverReports).set(await build(c, day, cover)).where(eq(coverReports.id, claimed[0]!.id));
      return true;
    });
  }

  /** E-mails every report not yet accepted by the mail server; the number now sent. */
  async function deliver(now: Date): Promise<number> {
    let sent = 0;
    for (const { id } of await unsentReports(db, new Date(now.getTime() - RETRY_DAYS * 86_400_000))) {
      const done = await withUnsentReport(
        db,
        id,
        async (report, owners) => {
          const sentTo = new Set(report.sentTo);
          for (const to of owners.filter((o) => !sentTo.has(o))) {
            try {
              await deps.mailer.send({ to, subject: report.subject, text: report.body });
              sentTo.add(to);
            } catch (err) {
              deps.logger?.warn({ err, reportId: report.id, collectionId: report.collectionId }, 'cover report not accepted by the mail server; retried on the next run');
              return { sentTo: [...sentTo], done: false };
            }
          }
          return { sentTo: [...sentTo], done: true };
        },
        now,
      );
      if (done) sent += 1;
    }
    return sent;
  }

  return {
    /**
     * Makes a report for every covered day that has ended, then e-mails every report the mail
     * server has not yet accepted (this run's and earlier failures). Safe to run as often as
     * wanted; returns how many reports were sent.
     */
    async runDue(): Promise<number> {
      const now = deps.now();
      const earliest = new Date(now.getTime() - (CATCH_UP_DAYS + 1) * 86_400_000);
      const covers = await db
        .select({ c: collections, startsAt: memberships.startsAt, endsAt: memberships.endsAt })
        .from(memberships)
        .innerJoin(collections, eq(collections.id, memberships.collectionId))
        .where(and(eq(memberships.role, 'helper'), isNotNull(memberships.startsAt), isNotNull(memberships.endsAt), lt(memberships.startsAt, now), sql`${memberships.endsAt} > ${earliest}`));
      for (const { c, startsAt, endsAt } of covers) {
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
            deps.logger?.error({ err, collectionId: c.id, localDate: day }, 'cover report could not be made');
          }
        }
      }
      return deliver(now);
    },

    async list(collectionId: string): Promise<CoverReportView[]> {
      const rows = await db.select().from(coverReports).where(eq(coverReports.collectionId, collectionId)).orderBy(desc(coverReports.localDate)).limit(60);
      return rows.filter((r) => r.subject).map((r) => ({ localDate: r.localDate, subject: r.subject, body: r.body, createdAt: r.createdAt.toISOString() }));
    },
  };
}
export type CoverReportsService = ReturnType<typeof createCoverReportsService>;
