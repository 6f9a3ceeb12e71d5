import { EVENT_WORDS, type EventKind } from '#shared/domain/event-kinds';
import {
  addDays,
  clockTime,
  describeLocalDate,
  startOfLocalDate,
  type LocalDate,
} from '#shared/domain/local-dates';
import type { AnimalState } from '#shared/domain/rounds/animal-state';
import { countsForProgress } from '#shared/domain/rounds/settle';
import type { Db } from '../../db/client';
import type { RoundsService } from '../rounds/rounds.service';
import {
  activeAnimalStates,
  eventsBetween,
  type ReportCollection,
} from './cover-reports.repository';

export interface CoverDays {
  firstDay: LocalDate;
  lastDay: LocalDate;
}

/**
 * The words of one covered day's report: what was fed, refused, skipped and noted, what needs
 * attention (the whole cover's summary is cover-summary.ts).
 */
/** A collection's facts of [from, to) that no undo has cancelled, oldest first. */
export async function factsBetween(db: Db, c: ReportCollection, from: Date, to: Date) {
  const rows = await eventsBetween(db, c.id, from, to);
  const voided = new Set(
    rows.filter((r) => r.kind === 'void').map((r) => (r.payload as { targetId?: string }).targetId),
  );
  return rows.filter((r) => r.kind !== 'void' && !voided.has(r.id));
}
export type Fact = Awaited<ReturnType<typeof factsBetween>>[number];

export function createReportText(
  db: Db,
  deps: { rounds: RoundsService; publicUrl: (path: string) => string },
) {
  return async function reportFor(c: ReportCollection, day: LocalDate, cover: CoverDays) {
    const facts = await factsBetween(
      db,
      c,
      startOfLocalDate(day, c.timeZone),
      startOfLocalDate(addDays(day, 1), c.timeZone),
    );
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
    const missed = round.items.filter((i) =>
      i.tasks.some((t) => countsForProgress(t.kind) && !t.done),
    );
    const twice = round.items.filter((i) => i.warnings.length > 0);
    const states = await activeAnimalStates(db, c.id);
    const streaks = states.filter((s) => (s.state as AnimalState).refusalStreak >= 2);
    const preyIn = states.filter((s) => (s.state as AnimalState).preyLeftIn !== null);
    const attention = [
      ...missed.map(
        (i) =>
          `- Not done: ${i.animal.name} (${i.animal.labelCode}) — ${i.tasks
            .filter((t) => countsForProgress(t.kind) && !t.done)
            .map((t) => t.kind.replace('_', ' '))
            .join(', ')}`,
      ),
      ...streaks.map(
        (s) =>
          `- Refused ${(s.state as AnimalState).refusalStreak} times in a row: ${s.name} (${s.code}) — possible premolt`,
      ),
      ...preyIn.map(
        (s) =>
          `- Prey still inside: ${s.name} (${s.code}) since ${describeLocalDate((s.state as AnimalState).preyLeftIn!.since)}`,
      ),
      ...twice.map((i) => `- ${i.animal.name} (${i.animal.labelCode}): ${i.warnings.join(' ')}`),
    ];

    const last = day === cover.lastDay;
    const subject = `${c.name}: cover report for ${describeLocalDate(day, true)}${last ? ' (last day)' : ''}`;
    const body = [
      `${c.name} — ${describeLocalDate(day, true)}`,
      '',
      ...(facts.length ? [] : ['Nothing was recorded this day.', '']),
      ...section('Fed', ['ate']),
      ...section('Refused', ['refused']),
      ...section('Skipped', ['skipped']),
      ...section('Notes', ['note']),
      ...(others.length
        ? [
            `Also recorded (${others.length})`,
            ...others.map((f) => `${line(f)} — ${EVENT_WORDS[f.kind as EventKind] ?? f.kind}`),
            '',
          ]
        : []),
      ...(attention.length
        ? ['Needs attention', ...attention, '']
        : ['Nothing needs attention.', '']),
      ...(last ? ['The summary of the whole cover comes in its own e-mail.', ''] : []),
      `Today's round and history: ${deps.publicUrl('/today')}`,
    ].join('\n');
    return { subject, body };
  };
}
