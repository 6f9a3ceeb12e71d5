import type { RoundCounts } from '../filter-items';

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/**
 * The round's progress in animals — what the cards and the filter chips count too — with the
 * tasks beside it (an animal may have a feed and a water) and the cards that only remind.
 */
export function ProgressBar({ counts }: { counts: RoundCounts }) {
  const { animals, tasks, reminders } = counts;
  const pct = animals.total ? Math.round((animals.done / animals.total) * 100) : 100;
  return (
    <div className="flex flex-col gap-1">
      <p className="flex justify-between font-bold">
        <span>
          {animals.done} of {plural(animals.total, 'animal', 'animals')} done
        </span>
        <span>{pct}%</span>
      </p>
      <div
        role="progressbar"
        aria-label="Round progress"
        aria-valuemin={0}
        aria-valuemax={animals.total}
        aria-valuenow={animals.done}
        aria-valuetext={`${animals.done} of ${plural(animals.total, 'animal', 'animals')} done`}
        className="h-4 overflow-hidden rounded-full border-2 border-border bg-bg"
      >
        <div className="h-full bg-primary" style={{ width: `${pct}%` }} />
      </div>
      <p className="text-sm text-muted">
        {tasks.done} of {plural(tasks.total, 'task', 'tasks')} recorded
        {reminders > 0 && ` · ${plural(reminders, 'animal', 'animals')} with nothing to record`}
        {' · '}the chips count animals
      </p>
    </div>
  );
}
