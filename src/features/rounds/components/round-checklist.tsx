import { Link } from 'react-router-dom';
import { CAUTION_LABEL } from '#shared/domain/animal-facts';
import { EVENT_WORDS } from '#shared/domain/event-kinds';
import { clockTime, describeLocalDate } from '#shared/domain/local-dates';
import type { RoundItemView, RoundTaskView } from '#shared/schemas/rounds';
import { Button } from '@/components/ui/button';
import { CautionIcon, LeaveAloneIcon } from '@/components/ui/icons';
import { Loading } from '@/components/ui/spinner';
import { useRound } from '../api/get-round';
import { placeCode } from '../filter-items';
import { RoundUnavailable } from './round-unavailable';
import { describeOffer, TASK_META } from './task-meta';

/** A box to tick with a pen; already ticked when the phone knows the task is done. */
function TickBox({ done }: { done: boolean }) {
  return (
    <span
      aria-hidden="true"
      className="inline-flex h-6 w-6 shrink-0 items-center justify-center rounded border-2 border-text font-extrabold leading-none"
    >
      {done ? '✓' : ''}
    </span>
  );
}

function TaskLine({ task, timeZone }: { task: RoundTaskView; timeZone: string }) {
  const { word } = TASK_META[task.kind];
  if (task.withdrawn)
    return (
      <li>
        <s>{word}</s> · withdrawn: {task.withdrawn.text}
      </li>
    );
  // Leave-alone is a reminder, not work: nothing to tick.
  if (task.kind === 'leave_alone')
    return (
      <li className="flex items-center gap-2 font-extrabold">
        <LeaveAloneIcon width={22} height={22} className="shrink-0" />
        {word}
      </li>
    );
  return (
    <li className="flex items-start gap-2">
      <TickBox done={!!task.done} />
      <span>
        <span className="font-bold">{word}</span>
        {task.offer && <> · {describeOffer(task.offer)}</>}
        {task.done && (
          <span className="text-sm">
            {' '}
            — {EVENT_WORDS[task.done.kind]} {clockTime(task.done.at, timeZone)}
            <span className="sr-only"> (done)</span>
          </span>
        )}
      </span>
    </li>
  );
}

function Row({ item, timeZone }: { item: RoundItemView; timeZone: string }) {
  const { animal } = item;
  return (
    <tr className="break-inside-avoid border-t-2 border-border align-top">
      <td className="py-2 pr-2 font-mono font-bold whitespace-nowrap">
        {placeCode(animal.location) ?? '—'}
      </td>
      <td className="py-2 pr-2">
        <span className="font-extrabold">{animal.name}</span>
        <span className="block text-sm">
          <i lang="la">{animal.scientificName}</i>
        </span>
        <span className="block font-mono text-sm">{animal.labelCode}</span>
        {animal.cautions.length > 0 && (
          <ul aria-label="Cautions" className="mt-1 flex flex-wrap gap-1 text-xs font-bold">
            {animal.cautions.map((c) => (
              <li
                key={c}
                className="inline-flex items-center gap-0.5 rounded border-2 border-danger px-1 text-danger"
              >
                <CautionIcon caution={c} width={14} height={14} className="shrink-0" />
                {CAUTION_LABEL[c]}
              </li>
            ))}
          </ul>
        )}
      </td>
      <td className="py-2">
        <ul className="flex flex-col gap-1">
          {item.tasks.map((t) => (
            <TaskLine key={t.kind} task={t} timeZone={timeZone} />
          ))}
        </ul>
      </td>
    </tr>
  );
}

/**
 * Today's round on paper, for keepers who would rather tick a sheet at the rack: one line per
 * animal in walk order with its place, name and species, tasks with a box each, and cautions.
 * Read from the phone's copy, so it prints with no signal too.
 */
export function RoundChecklist({ userId, collectionId }: { userId: string; collectionId: string }) {
  const { local, server } = useRound(userId, collectionId, 'today');
  if (local.isPending || (!local.data && server.isPending))
    return <Loading label="Loading today’s round…" />;
  if (!local.data) return <RoundUnavailable error={server.error} what="today’s round" />;
  const { round, fetchedAt } = local.data;
  return (
    <div className="print-ink flex flex-col gap-3">
      <div className="flex flex-wrap items-center gap-2 print:hidden">
        <Button onClick={() => window.print()}>Print</Button>
        <Link
          to="/today"
          className="inline-flex min-h-target items-center rounded-xl px-2 font-bold underline underline-offset-4"
        >
          Back to today’s round
        </Link>
      </div>
      <h1 className="text-2xl font-extrabold">Round checklist · {describeLocalDate(round.date)}</h1>
      <p className="text-sm">
        {round.items.length} {round.items.length === 1 ? 'animal' : 'animals'} in walk order · as
        this phone had it at {clockTime(fetchedAt, round.timeZone)}. Tick each box as you go, then
        record the outcomes in Rackside.
      </p>
      {round.items.length ? (
        <div className="overflow-x-auto">
          <table className="w-full border-collapse text-left">
            <caption className="sr-only">Today’s round, one animal a row</caption>
            <thead>
              <tr className="text-sm">
                <th scope="col" className="pr-2">
                  Place
                </th>
                <th scope="col" className="pr-2">
                  Animal · cautions
                </th>
                <th scope="col">Tasks</th>
              </tr>
            </thead>
            <tbody>
              {round.items.map((item) => (
                <Row key={item.animal.id} item={item} timeZone={round.timeZone} />
              ))}
            </tbody>
          </table>
        </div>
      ) : (
        <p>Nothing is due today.</p>
      )}
    </div>
  );
}
