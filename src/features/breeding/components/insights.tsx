import {
  GROUP_LABEL,
  STAGE_LABEL,
  type AnimalGroup,
  type LifeStage,
} from '#shared/domain/animal-facts';
import { breedingModeOf, isOpenRecord } from '#shared/domain/breeding';
import { formatDateRange } from '#shared/domain/date-words';
import { isOverdue, isPossiblePremolt } from '#shared/domain/rounds/item-status';
import type { AnimalSummary } from '#shared/schemas/animals';
import type { EggSacView } from '#shared/schemas/breeding';
import type { RoundItemView } from '#shared/schemas/rounds';

/** A bar per value: counts people would rather see than read (text stays beside each bar). */
function Bars({ title, rows }: { title: string; rows: [string, number][] }) {
  const max = Math.max(1, ...rows.map(([, n]) => n));
  return (
    <section aria-label={title} className="flex flex-col gap-1">
      <h2 className="text-xl font-extrabold">{title}</h2>
      <ul className="flex flex-col gap-1">
        {rows.map(([label, n]) => (
          <li key={label} className="grid grid-cols-[7rem_1fr_3rem] items-center gap-2">
            <span className="truncate">{label}</span>
            <span
              aria-hidden="true"
              className="h-5 rounded bg-primary"
              style={{ width: `${(n / max) * 100}%` }}
            />
            <span className="text-right font-bold">{n}</span>
          </li>
        ))}
      </ul>
    </section>
  );
}

function List({ title, empty, items }: { title: string; empty: string; items: string[] }) {
  return (
    <section
      aria-label={title}
      className="flex flex-col gap-1 rounded-2xl border-2 border-border bg-surface p-3"
    >
      <h2 className="text-lg font-extrabold">
        {title} <span className="text-muted">({items.length})</span>
      </h2>
      {items.length ? (
        <ul className="list-disc pl-5">
          {items.map((i) => (
            <li key={i}>{i}</li>
          ))}
        </ul>
      ) : (
        <p className="text-muted">{empty}</p>
      )}
    </section>
  );
}

const hasReason = (item: RoundItemView, code: string) =>
  [...item.notes, ...item.tasks.flatMap((t) => t.reasons)].some((r) => r.code === code);

/** The collection at a glance: what there is, and what needs an eye today. */
export function Insights({
  animals,
  round,
  sacs,
  today,
}: {
  animals: readonly AnimalSummary[];
  round: readonly RoundItemView[];
  sacs: readonly EggSacView[];
  today: string;
}) {
  const kept = animals.filter((a) => a.status === 'active');
  const count = <K extends string>(
    keys: readonly K[],
    of: (a: AnimalSummary) => K,
    words: Record<K, string>,
  ): [string, number][] =>
    keys
      .map((k) => [words[k], kept.filter((a) => of(a) === k).length] as [string, number])
      .filter(([, n]) => n > 0);
  const name = (i: RoundItemView) => `${i.animal.name} (${i.animal.labelCode})`;
  return (
    <div className="flex flex-col gap-4">
      <p className="text-lg font-bold">{kept.length} animals kept</p>
      <Bars
        title="By stage"
        rows={count(Object.keys(STAGE_LABEL) as LifeStage[], (a) => a.lifeStage, STAGE_LABEL)}
      />
      <Bars
        title="By group"
        rows={count(Object.keys(GROUP_LABEL) as AnimalGroup[], (a) => a.group, GROUP_LABEL)}
      />
      <List
        title="Possible premolts"
        empty="None today."
        items={round.filter(isPossiblePremolt).map(name)}
      />
      <List
        title="Females rebuilding"
        empty="None."
        items={round.filter((i) => hasReason(i, 'rebuild')).map(name)}
      />
      <List
        title="Sacs, egg cases and broods due"
        empty="Nothing is due."
        items={sacs
          .filter((s) => isOpenRecord(s) && today >= s.expectedFrom)
          .map(
            (s) =>
              `${breedingModeOf(s.femaleGroup).words.record}: ${s.clutch} (${s.femaleName}), expected ${formatDateRange(s.expectedFrom, s.expectedTo)}`,
          )}
      />
      <List
        title="Overdue"
        empty="Nothing is carried over."
        items={round.filter(isOverdue).map((i) => `${name(i)}, ${i.carriedOverDays} days`)}
      />
    </div>
  );
}
