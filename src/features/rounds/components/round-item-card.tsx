import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { SEX_LABEL, stageLabel } from '#shared/domain/animal-facts';
import { EVENT_WORDS } from '#shared/domain/event-kinds';
import { clockTime } from '#shared/domain/local-dates';
import { placeShort } from '#shared/domain/places';
import { currentNotes } from '#shared/domain/rounds/item-status';
import type { Outcome, RoundItemView } from '#shared/schemas/rounds';
import { Button } from '@/components/ui/button';
import { CautionBadges } from '@/components/ui/caution-badges';
import { HoldIcon } from '@/components/ui/icons';
import { outcomeLook } from '@/components/ui/outcome-mark';
import { placeCode } from '../filter-items';
import { describeOffer, TASK_META } from './task-meta';

interface Props {
  item: RoundItemView;
  timeZone: string;
  /** The signed-in person: their own outcomes do not repeat their name. */
  myName?: string;
  /** Outcome buttons on today's round; none on a preview. */
  children?: ReactNode;
  /** A link to the animal's page: only for people the server lets read it (keepers, owners). */
  openRecord?: boolean;
  /** Undo a task's outcome (a void), so a finished card can be changed. */
  onUndo?: (eventId: string, word: string) => void;
  /** Shown in the header's corner, e.g. a button folding a finished card back to its row. */
  corner?: ReactNode;
}

function DoneBadge({
  done,
  timeZone,
  myName,
}: {
  done: Outcome;
  timeZone: string;
  myName?: string;
}) {
  const who = done.by && done.by !== myName ? ` by ${done.by}` : '';
  return (
    <span
      className={`ml-2 inline-block rounded-md border-2 px-1.5 text-sm ${outcomeLook(done.kind).className}`}
    >
      <span aria-hidden="true">{outcomeLook(done.kind).symbol} </span>
      {EVENT_WORDS[done.kind]} {clockTime(done.at, timeZone)}
      {who}
    </span>
  );
}

/** A task a hold took off today's round (R18): struck through, with the reason in its place. */
function WithdrawnTask({ word, reason }: { word: string; reason: string }) {
  return (
    <li className="flex gap-2 rounded-lg border-2 border-danger p-2">
      <HoldIcon className="shrink-0 text-danger" />
      <div className="flex-1">
        <p className="font-extrabold">
          <s>{word}</s> <span className="text-danger">· withdrawn</span>
        </p>
        <p className="font-bold">{reason}</p>
      </div>
    </li>
  );
}

/** One animal on the round: what, where, how much and why, without opening anything. */
export function RoundItemCard({
  item,
  timeZone,
  myName,
  children,
  openRecord,
  onUndo,
  corner,
}: Props) {
  const { animal } = item;
  const notes = currentNotes(item);
  // One outcome may settle several tasks (a meal settles the check too): one Undo for it.
  const undoOffered = new Set<string>();
  const offerUndo = (eventId: string) =>
    !!onUndo && !undoOffered.has(eventId) && !!undoOffered.add(eventId);
  return (
    <article
      aria-label={`${animal.name}, ${animal.labelCode}`}
      className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3"
    >
      <header className="flex items-start justify-between gap-2">
        <div>
          <h3 className="text-xl font-extrabold leading-tight">{animal.name}</h3>
          <p className="text-sm text-muted">
            <i lang="la">{animal.scientificName}</i> · {stageLabel(animal.group, animal.lifeStage)}{' '}
            · {SEX_LABEL[animal.sex]}
          </p>
        </div>
        <div className="flex flex-col items-end gap-1">
          <span className="whitespace-nowrap rounded-md border-2 border-border px-2 font-mono font-bold tracking-wider">
            {animal.labelCode}
          </span>
          <span className="font-bold">{placeShort(animal.location)}</span>
        </div>
      </header>
      {corner}
      {/* Safety first: cautions sit above the tasks. */}
      <CautionBadges cautions={animal.cautions} />
      {item.warnings.map((w) => (
        <p
          key={w}
          role="alert"
          className="rounded-lg border-2 border-accent px-2 py-1 font-bold text-accent"
        >
          <span aria-hidden="true">! </span>
          {w}
        </p>
      ))}
      <ul className="flex flex-col gap-2">
        {item.tasks.map((task) => {
          const { word, Icon } = TASK_META[task.kind];
          if (task.withdrawn)
            return <WithdrawnTask key={task.kind} word={word} reason={task.withdrawn.text} />;
          return (
            <li key={task.kind} className="flex gap-2">
              <Icon
                className={
                  task.kind === 'leave_alone' || task.kind === 'remove_prey'
                    ? 'shrink-0 text-danger'
                    : 'shrink-0 text-text'
                }
              />
              <div className="flex-1">
                <p className="font-extrabold">
                  {word}
                  {task.offer && <span className="font-bold"> · {describeOffer(task.offer)}</span>}
                  {task.carriedOverDays > 0 && (
                    <span className="ml-2 inline-block rounded-md border-2 border-accent px-1.5 text-sm text-accent">
                      carried over {task.carriedOverDays}{' '}
                      {task.carriedOverDays === 1 ? 'day' : 'days'}
                    </span>
                  )}
                  {task.done && <DoneBadge done={task.done} timeZone={timeZone} myName={myName} />}
                </p>
                {task.done && offerUndo(task.done.eventId) && (
                  <Button
                    variant="secondary"
                    className="mt-1 px-3 text-base"
                    onClick={() => onUndo?.(task.done!.eventId, EVENT_WORDS[task.done!.kind])}
                  >
                    Undo {EVENT_WORDS[task.done.kind]}
                    <span className="sr-only"> for {animal.name}</span>
                  </Button>
                )}
                <ul className="text-sm text-muted">
                  {task.reasons.map((r) => (
                    <li key={r.code + r.text}>{r.text}</li>
                  ))}
                </ul>
              </div>
            </li>
          );
        })}
      </ul>
      {notes.length > 0 && (
        <ul className="border-t-2 border-border pt-2 text-sm">
          {notes.map((n) => (
            <li key={n.code + n.text}>
              <span aria-hidden="true">ℹ </span>
              {n.text}
            </li>
          ))}
        </ul>
      )}
      {children}
      {openRecord && (
        <Link
          to={`/animals/${animal.id}`}
          className="inline-flex min-h-target items-center self-start rounded-xl px-2 font-bold underline underline-offset-4"
        >
          Open record<span className="sr-only"> of {animal.name}</span>
        </Link>
      )}
    </article>
  );
}

/** The outcomes that settled a finished card's tasks, each once, in the order they were made. */
export function settledOutcomes(item: RoundItemView): Outcome[] {
  const seen = new Map<string, Outcome>();
  for (const t of item.tasks)
    if (t.done && !seen.has(t.done.eventId)) seen.set(t.done.eventId, t.done);
  return [...seen.values()].sort((a, b) => (a.at < b.at ? -1 : a.at > b.at ? 1 : 0));
}

/**
 * A finished card folded to one compact row: the animal, its place and what was recorded.
 * "Change" opens the whole card again, where an outcome can be undone and recorded anew.
 */
export function DoneRow({
  item,
  timeZone,
  myName,
  onExpand,
  children,
}: {
  item: RoundItemView;
  timeZone: string;
  myName?: string;
  onExpand: () => void;
  /** Under the row, e.g. how a photo sent with the outcome is getting on. */
  children?: ReactNode;
}) {
  const { animal } = item;
  return (
    <article
      aria-label={`${animal.name}, ${animal.labelCode}`}
      data-state="done"
      className="flex flex-col rounded-2xl border-2 border-border bg-surface px-3 py-1"
    >
      <div className="flex items-center gap-2">
        <div className="min-w-0 flex-1">
          <p className="truncate">
            <span className="font-extrabold">{animal.name}</span>{' '}
            <span className="font-mono text-sm font-bold">
              {placeCode(animal.location) ?? animal.labelCode}
            </span>
          </p>
          <p className="text-sm font-bold text-ok">
            {settledOutcomes(item).map((o, i) => {
              const who = o.by && o.by !== myName ? ` by ${o.by}` : '';
              return (
                <span key={o.eventId}>
                  {i > 0 && ' · '}
                  <span aria-hidden="true">✓ </span>
                  {EVENT_WORDS[o.kind]} {clockTime(o.at, timeZone)}
                  {who}
                </span>
              );
            })}
          </p>
        </div>
        <Button
          variant="secondary"
          aria-expanded={false}
          className="shrink-0 px-3 text-base"
          onClick={onExpand}
        >
          Change<span className="sr-only"> {animal.name}</span>
        </Button>
      </div>
      {children}
    </article>
  );
}
