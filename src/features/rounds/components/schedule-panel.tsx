import { shortDate } from '#shared/domain/rounds/build-round';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { useSchedule } from '../api/schedule';
import { describeOffer, TASK_META } from './task-meta';

/** Why this animal is (or is not) on today's round, and when it is next due. */
export function SchedulePanel({ collectionId, animalId }: { collectionId: string; animalId: string }) {
  const schedule = useSchedule(collectionId, animalId);
  if (schedule.isPending) return <Loading label="Working out the schedule…" />;
  if (schedule.isError) return <Notice tone="error" title={schedule.error.message} />;
  const s = schedule.data;
  return (
    <section aria-labelledby="schedule-heading" className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3">
      <h2 id="schedule-heading" className="text-xl font-extrabold">
        Schedule
      </h2>
      <p className="font-bold">{s.onRound ? 'On today’s round:' : 'Not on today’s round.'}</p>
      {s.tasks.length > 0 && (
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
      {s.notes.length > 0 && (
        <ul className="text-sm">
          {s.notes.map((n) => (
            <li key={n.text}>
              <span aria-hidden="true">ℹ </span>
              {n.text}
            </li>
          ))}
        </ul>
      )}
      <dl className="grid grid-cols-2 gap-x-3 text-sm">
        <dt className="text-muted">Next meal</dt>
        <dd className="font-bold">{s.nextFeed ? shortDate(s.nextFeed) : 'held back (see above)'}</dd>
        <dt className="text-muted">Next water</dt>
        <dd className="font-bold">{s.nextWater ? shortDate(s.nextWater) : 'no water dish'}</dd>
      </dl>
    </section>
  );
}
