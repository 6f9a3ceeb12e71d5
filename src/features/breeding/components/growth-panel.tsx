import { lazy, Suspense, useMemo } from 'react';
import {
  acceptanceRate,
  growthSeries,
  mealIntervals,
  moltsInLastYear,
  type MoltFact,
} from '#shared/domain/growth';
import { daysBetween, localDateOf } from '#shared/domain/local-dates';
import { sizeInUnit, type SizeUnit } from '#shared/domain/units';
import type { HistoryEvent } from '#shared/schemas/events';
import { Loading } from '@/components/ui/spinner';

const GrowthChart = lazy(() => import('./growth-chart'));
const OFFERS = 10;

/** How the animal grows and eats, from its own history. */
export function GrowthPanel({
  events,
  timeZone,
  unit,
  measure = 'Leg span',
}: {
  events: readonly HistoryEvent[];
  timeZone: string;
  unit: SizeUnit;
  /** What the size is: "Leg span" for spiders, "Body length" for the rest. */
  measure?: string;
}) {
  const today = localDateOf(new Date(), timeZone);
  const facts = useMemo(() => {
    const kept = events.filter((e) => !e.voidedBy && e.kind !== 'void');
    const day = (e: HistoryEvent) => localDateOf(new Date(e.at), timeZone);
    const molts: MoltFact[] = kept
      .filter((e) => e.kind === 'molted')
      .map((e) => ({ date: day(e), ...(e.payload as Omit<MoltFact, 'date'>) }));
    const offers = kept
      .filter((e) => e.kind === 'ate' || e.kind === 'refused')
      .map((e) => ({ date: day(e), kind: e.kind as 'ate' | 'refused' }));
    const meals = offers.filter((o) => o.kind === 'ate').map((o) => o.date);
    // Refusals since the last meal or molt: the premolt sign keepers watch.
    const sinceLast = [...kept].sort((a, b) => b.at.localeCompare(a.at));
    let streak = 0;
    for (const e of sinceLast) {
      if (e.kind === 'refused') streak += 1;
      else if (e.kind === 'ate' || e.kind === 'molted') break;
    }
    return { series: growthSeries(molts), offers, meals, streak };
  }, [events, timeZone]);
  const { series, offers, meals, streak } = facts;
  const last = series.at(-1);
  const accept = acceptanceRate(offers, OFFERS);
  const intervals = mealIntervals(meals);
  const lastMeal = [...meals].sort().at(-1);
  const sized = series
    .filter((p) => p.sizeMm !== null)
    .map((p) => ({ ...p, sizeMm: sizeInUnit(p.sizeMm!, unit) }));
  return (
    <section aria-labelledby="growth-heading" className="flex flex-col gap-2">
      <h2 id="growth-heading" className="text-xl font-extrabold">
        Growth and feeding
      </h2>
      <dl className="grid grid-cols-2 gap-2">
        {[
          ['Molts in the last year', String(moltsInLastYear(series, today))],
          ['Days since the last molt', last ? String(daysBetween(last.date, today)) : '—'],
          [
            'Between the last two molts',
            last?.daysSincePrevious != null ? `${last.daysSincePrevious} days` : '—',
          ],
          accept.offered === 0
            ? ['Ate when offered', 'No offers yet']
            : [
                accept.offered === 1 ? 'Ate, last offer' : `Ate, last ${accept.offered} offers`,
                `${accept.ate} of ${accept.offered} (${accept.rate} %)`,
              ],
          ['Usual days between meals', intervals.median === null ? '—' : String(intervals.median)],
          ['Since the last meal', lastMeal ? `${daysBetween(lastMeal, today)} days` : '—'],
          [
            'Refusals in a row',
            streak ? `${streak}${streak >= 2 ? ' · possible premolt' : ''}` : '0',
          ],
        ].map(([term, value]) => (
          <div key={term} className="rounded-xl border-2 border-border bg-surface p-2">
            <dt className="text-sm text-muted">{term}</dt>
            <dd className="text-lg font-extrabold">{value}</dd>
          </div>
        ))}
      </dl>
      {sized.length >= 1 ? (
        <Suspense fallback={<Loading label="Drawing the chart…" />}>
          <GrowthChart points={sized} unit={unit} measure={measure} />
        </Suspense>
      ) : (
        <p className="text-sm text-muted">
          The chart appears after the first molt recorded with a size.
        </p>
      )}
    </section>
  );
}
