import { EVENT_WORDS } from '#shared/domain/event-kinds';
import { clockTime } from '#shared/domain/local-dates';
import { shortDate } from '#shared/domain/rounds/build-round';
import { currentNotes } from '#shared/domain/rounds/item-status';
import type { RoundItemView } from '#shared/schemas/rounds';
import { Notice } from '@/components/ui/notice';
import { outcomeLook } from '@/components/ui/outcome-mark';
import { Loading } from '@/components/ui/spinner';
import { useSchedule } from '../api/schedule';
import { describeOffer, TASK_META } from './task-meta';

/** Today's item as the round shows it now: each task done, withdrawn or still to do. */
function TodayTasks({ item, timeZone }: { item: RoundItemView; timeZone: string }) {
  return (
    <ul className="flex flex-col gap-1">
      {item.tasks.map((t) => (
        <li key={t.kind}>
          <span className="font-extrabold">
            {t.withdrawn ? <s>{TASK_META[t.kind].word}</s> : TASK_META[t.kind].word}
          </span>
          {t.offer && !t.withdrawn && ` · ${describeOffer(t.offer)}`}
          {t.done && (
            <span className={`font-bold ${outcomeLook(t.done.kind).className}`}>
              {' '}
              · {outcomeLook(t.done.kind).symbol} {EVENT_WORDS[t.done.kind]}{' '}
              {clockTime(t.done.at, timeZone)}
            </span>
          )}
          <ul className="text-sm text-muted">
            {(t.withdrawn ? [t.withdrawn] : t.reasons).map((r) => (
              <li key={r.text}>{r.text}</li>
            ))}
          </ul>
        </li>
      ))}
    </ul>
  );
}

/**
 * Why this animal is (or is not) on today's round, and when it is next due. `item` is the
 * phone's copy of its round item, taps included, so this agrees with the round even before a
 * tap has been sent; the next dates come from the server and refresh after each sync.
 */
export function SchedulePanel({
  collectionId,
  animalId,
  item,
  timeZone,
  waiting,
}: {
  collectionId: string;
  animalId: string;
  item?: RoundItemView;
  timeZone: string;
  waiting: boolean;
}) {
  const schedule = useSchedule(collectionId, animalId);
  if (schedule.isPending && !item) return <Loading label="Working out the schedule…" />;
  if (schedule.isError && !item) return <Notice tone="error" title={schedule.error.message} />;
  const s = schedule.data;
  const notes = item ? currentNotes(item) : (s?.notes ?? []);
  return (
    <section
      aria-labelledby="schedule-heading"
      className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3"
    >
      <h2 id="schedule-heading" className="text-xl font-extrabold">
        Schedule
      </h2>
      <p className="font-bold">
        {item || s?.onRound ? 'On today’s round:' : 'Not on today’s round.'}
      </p>
      {item && <TodayTasks item={item} timeZone={timeZone} />}
      {!item && s && s.tasks.length > 0 && (
        <ul className="flex flex-col gap-1">
          {s.tasks.map((t) => (
            <li key={t.kind}>
              <span className="font-extrabold">{TASK_META[t.kind].word}</span>
              {t.offer && ` · ${describeOffer(t.offer)}`}
              <ul className="text-sm text-muted">
                {t.reasons.map((r) => (
                  <li key={r.text}>{r.text}</li>
                ))}
              </ul>
            </li>
          ))}
        </ul>
      )}
      {notes.length > 0 && (
        <ul className="text-sm">
          {notes.map((n) => (
            <li key={n.text}>
              <span aria-hidden="true">ℹ </span>
              {n.text}
            </li>
          ))}
        </ul>
      )}
      {s ? (
        <dl className="grid grid-cols-2 gap-x-3 text-sm">
          <dt className="text-muted">Next meal</dt>
          <dd className="font-bold">
            {s.nextFeed ? shortDate(s.nextFeed) : 'held back (see above)'}
          </dd>
          <dt className="text-muted">Next water</dt>
          <dd className="font-bold">{s.nextWater ? shortDate(s.nextWater) : 'no water dish'}</dd>
        </dl>
      ) : (
        <p className="text-sm text-muted">
          The next meal and water dates come with the next signal.
        </p>
      )}
      {waiting && (
        <p className="text-sm text-muted">
          Taps on this phone are still waiting to be sent: the next dates update after the next
          sync.
        </p>
      )}
    </section>
  );
}
