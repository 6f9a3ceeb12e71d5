import { EVENT_WORDS, type EventKind } from '#shared/domain/event-kinds';
import { HELPER_REPORT_WORDS } from '#shared/domain/helper-reports';
import { describeInstant, describeLocalDate } from '#shared/domain/local-dates';
import type { HelperReportView } from '#shared/schemas/helper-reports';
import type { Background } from '../../background';
import type { Db } from '../../db/client';
import type { Logger } from '../../logger';
import type { Mailer } from '../../mail/mailer';
import { daysOf } from './cover-days';
import { deliverReport } from './cover-report-delivery';
import { factsBetween, type Fact } from './cover-report-text';
import {
  claimSummary,
  coverForSummary,
  endedCoversWithoutSummary,
  handoverNotesForCover,
  writeReport,
} from './cover-reports.repository';
import { generalNoteOf } from './handover-notes.repository';

/** Summaries are made for covers that ended in the last four days (a server that was down catches up). */
const CATCH_UP_MS = 4 * 86_400_000;

export interface CoverSummaryDeps {
  mailer: Mailer;
  now: () => Date;
  publicUrl: (path: string) => string;
  background: Background;
  logger?: Logger;
  /** The helpers' reports (escape, bite, death, …) made in [from, to): a feature above this one. */
  problemsBetween: (collectionId: string, from: Date, to: Date) => Promise<HelperReportView[]>;
}

/**
 * When a cover ends — on its last day or early, by the owner — one summary of the whole cover:
 * what was fed, refused and noted, the problems helpers reported and the handover notes that
 * were in force. Kept with the daily reports (one row per cover) and e-mailed to every owner
 * by the same lock-send-mark delivery.
 */
export function createCoverSummaries(db: Db, deps: CoverSummaryDeps) {
  async function textFor(coverId: string) {
    const cover = await coverForSummary(db, coverId);
    if (!cover?.startsAt || !cover.endsAt || !cover.acceptedAt) return null;
    const { c, startsAt, endsAt } = cover;
    if (startsAt >= endsAt) return null; // ended before it began: nothing to sum up
    const zone = c.timeZone;
    const { firstDay, lastDay } = daysOf(startsAt, endsAt, zone);
    const helper = cover.helperName ?? cover.email;
    const facts = await factsBetween(db, c, startsAt, endsAt);
    const problems = await deps.problemsBetween(c.id, startsAt, endsAt);
    const notes = await handoverNotesForCover(db, c.id, firstDay);
    const generalNote = await generalNoteOf(db, c.id);

    const when = (at: Date) => describeInstant(at.toISOString(), zone);
    const who = (f: Fact) => (f.by ? ` by ${f.by}` : '');
    /** Per animal: how many times, and when (a week of meals stays short). */
    const perAnimal = (title: string, kind: EventKind) => {
      const list = facts.filter((f) => f.kind === kind);
      if (!list.length) return [];
      const byAnimal = new Map<string, Fact[]>();
      for (const f of list) {
        const key = `${f.animal} (${f.code})`;
        byAnimal.set(key, [...(byAnimal.get(key) ?? []), f]);
      }
      return [
        `${title} (${list.length})`,
        ...[...byAnimal.entries()].map(
          ([animal, fs]) => `- ${animal}: ${fs.map((f) => `${when(f.at)}${who(f)}`).join('; ')}`,
        ),
        '',
      ];
    };
    const noted = facts.filter((f) => f.kind === 'note');
    const others = facts.filter((f) => !['ate', 'refused', 'note'].includes(f.kind));
    const counts = new Map<string, number>();
    for (const f of facts) counts.set(f.kind, (counts.get(f.kind) ?? 0) + 1);

    // An early end made endsAt the moment it ended: the range is the days actually covered.
    const range = `${describeLocalDate(firstDay, true)} to ${describeLocalDate(lastDay, true)}`;
    const subject = `${c.name}: summary of ${helper}’s cover, ${range}`;
    const body = [
      `${c.name} — ${helper}’s cover is over: ${range} (ended ${when(endsAt)}).`,
      '',
      'In numbers',
      ...(counts.size
        ? [...counts.entries()].map(([k, n]) => `- ${EVENT_WORDS[k as EventKind] ?? k}: ${n}`)
        : ['- Nothing was recorded during the cover.']),
      '',
      ...perAnimal('Fed', 'ate'),
      ...perAnimal('Refused', 'refused'),
      ...(noted.length
        ? [
            `Noted (${noted.length})`,
            ...noted.map((f) => {
              const p = f.payload as { text?: string };
              return `- ${when(f.at)} ${f.animal} (${f.code})${who(f)}: ${p.text ?? ''}`;
            }),
            '',
          ]
        : []),
      ...(others.length
        ? [
            `Also recorded (${others.length})`,
            ...others.map(
              (f) =>
                `- ${when(f.at)} ${f.animal} (${f.code})${who(f)} — ${EVENT_WORDS[f.kind as EventKind] ?? f.kind}`,
            ),
            '',
          ]
        : []),
      ...(problems.length
        ? [
            `Problems reported (${problems.length})`,
            ...[...problems].reverse().map((p) => {
              const animal = p.animal
                ? ` — ${p.animal.name} (${p.animal.labelCode})`
                : p.animalText
                  ? ` — ${p.animalText}`
                  : '';
              return `- ${when(new Date(p.createdAt))} ${HELPER_REPORT_WORDS[p.kind]}${animal}, by ${p.reportedBy}: ${p.note}`;
            }),
            '',
          ]
        : ['No problems were reported.', '']),
      'Handover notes for this cover',
      ...(generalNote ? [`- For everything: ${generalNote}`] : []),
      ...notes.map(
        (n) =>
          `- ${n.animal} (${n.code}), until ${describeLocalDate(n.until)}${n.doNotFeed ? ', do not feed' : ''}: ${n.text}`,
      ),
      ...(generalNote || notes.length
        ? ['Remove the notes that no longer apply on the cover page.']
        : ['- There were none.']),
      '',
      `Taps that reach Rackside from ${helper}’s phone after this summary show in the animals’ timelines.`,
      `The cover page: ${deps.publicUrl('/cover')}`,
    ].join('\n');
    return { collectionId: c.id, lastDay, subject, body };
  }

  /** Makes the cover's summary once; its report id, or null when there is none to make or it exists. */
  async function make(coverId: string, now: Date): Promise<string | null> {
    const text = await textFor(coverId);
    if (!text) return null;
    return db.transaction(async (tx) => {
      const id = await claimSummary(tx, text.collectionId, coverId, text.lastDay, now);
      if (!id) return null;
      await writeReport(tx, id, { subject: text.subject, body: text.body });
      return id;
    });
  }

  return {
    /**
     * An owner ended the cover: the summary is made now (the app shows it with the answer)
     * and e-mailed after the answer; the cover-report job retries a refused e-mail.
     */
    async afterEarlyEnd(coverId: string) {
      const now = deps.now();
      const id = await make(coverId, now);
      if (id)
        deps.background.run('cover summary mail', async () => {
          await deliverReport(db, deps.mailer, deps.logger, id, now);
        });
    },

    /** Makes the summary of every cover that ended by itself (or was missed); the job sends them. */
    async makeDue(): Promise<number> {
      const now = deps.now();
      let made = 0;
      for (const { id } of await endedCoversWithoutSummary(
        db,
        now,
        new Date(now.getTime() - CATCH_UP_MS),
      )) {
        try {
          if (await make(id, now)) made += 1;
        } catch (err) {
          deps.logger?.error({ err, coverId: id }, 'cover summary could not be made');
        }
      }
      return made;
    },
  };
}
export type CoverSummaries = ReturnType<typeof createCoverSummaries>;
