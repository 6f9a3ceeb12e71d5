import { lazy, Suspense, useMemo, useState } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import { COLONY_CARE_KINDS, COLONY_CARE_WORDS } from '#shared/domain/colonies/care';
import { stockSeries } from '#shared/domain/colonies/stock-series';
import { formatLocalDate } from '#shared/domain/date-words';
import { describeInstant } from '#shared/domain/local-dates';
import type { ColonyView, StockHistoryResponse } from '#shared/schemas/colonies';
import { NoCollection } from '@/app/layout/no-collection';
import { useShell } from '@/app/layout/use-shell';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import {
  useColonies,
  useColonyChanges,
  useStockHistory,
} from '@/features/colonies/api/colonies-api';
import { ColonyForm } from '@/features/colonies/components/colony-form';
import { CountUpdate } from '@/features/colonies/components/count-update';
import { FeederSafety } from '@/features/colonies/components/feeder-safety';
import { useRules } from '@/features/rounds/api/rules';

const StockChart = lazy(() => import('@/features/colonies/components/stock-chart'));

const REASON_WORDS: Record<StockHistoryResponse['changes'][number]['reason'], string> = {
  count: 'Count',
  round: 'Round',
  split: 'Split',
  correction: 'Correction',
};

/** One colony: its stock, a quick count, its stock over time and its care settings. */
export function ColonyRoute() {
  const { collection } = useShell();
  const { colonyId = '' } = useParams();
  if (!collection) return <NoCollection />;
  if (collection.role === 'helper')
    return <Notice tone="info" title="Feeder colonies are kept by the collection’s keepers." />;
  return (
    <Colony
      collectionId={collection.collectionId}
      timeZone={collection.timeZone}
      colonyId={colonyId}
    />
  );
}

function Colony({
  collectionId,
  timeZone,
  colonyId,
}: {
  collectionId: string;
  timeZone: string;
  colonyId: string;
}) {
  const colonies = useColonies(collectionId);
  const colony = colonies.data?.colonies.find((c) => c.id === colonyId);
  if (colonies.isPending) return <Loading />;
  if (colonies.isError) return <Notice tone="error" title={colonies.error.message} />;
  if (!colony) return <Notice tone="error" title="We could not find that colony." />;
  return <ColonyPage collectionId={collectionId} timeZone={timeZone} colony={colony} />;
}

function ColonyPage({
  collectionId,
  timeZone,
  colony,
}: {
  collectionId: string;
  timeZone: string;
  colony: ColonyView;
}) {
  const { count, update, remove } = useColonyChanges(collectionId);
  const history = useStockHistory(collectionId, colony.id);
  const rules = useRules(collectionId);
  const navigate = useNavigate();
  const [editing, setEditing] = useState(false);
  const points = useMemo(() => stockSeries(history.data?.changes ?? []), [history.data]);
  return (
    <div className="flex flex-col gap-4">
      <h1 className="text-3xl font-extrabold">{colony.name}</h1>
      <p className="text-muted">
        {colony.species ? `${colony.species} · ` : ''}
        {colony.preyType}
      </p>
      <section aria-labelledby="stock-heading" className="flex flex-col gap-2">
        <h2 id="stock-heading" className="text-xl font-extrabold">
          Stock now
        </h2>
        <dl className="grid grid-cols-2 gap-2">
          {colony.stock.map((s) => (
            <div key={s.preySize} className="rounded-xl border-2 border-border p-2">
              <dt className="text-muted">{s.preySize}</dt>
              <dd className="text-2xl font-extrabold tabular-nums">{s.count}</dd>
            </div>
          ))}
        </dl>
      </section>
      <section
        aria-labelledby="count-heading"
        className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3"
      >
        <h2 id="count-heading" className="text-xl font-extrabold">
          Quick count
        </h2>
        <CountUpdate
          key={colony.updatedAt + colony.stock.map((s) => s.count).join()}
          colony={colony}
          busy={count.isPending}
          error={count.error?.message ?? null}
          onSubmit={(body) => count.mutate({ colonyId: colony.id, body })}
        />
        {count.isSuccess && <Notice tone="ok" title="Counts saved." />}
      </section>
      <section aria-labelledby="history-heading" className="flex flex-col gap-2">
        <h2 id="history-heading" className="text-xl font-extrabold">
          Stock over time
        </h2>
        {history.isPending && <Loading />}
        {history.isError && <Notice tone="error" title={history.error.message} />}
        {history.data && points.length === 0 && <p>No counts yet.</p>}
        {points.length > 0 && (
          <Suspense fallback={<Loading />}>
            <StockChart
              points={points}
              sizes={colony.stock.map((s) => s.preySize)}
              timeZone={timeZone}
            />
          </Suspense>
        )}
        {history.data && history.data.changes.length > 0 && (
          <details>
            <summary className="flex min-h-target cursor-pointer items-center font-bold">
              Every change ({history.data.changes.length})
            </summary>
            <table className="w-full border-collapse text-left">
              <caption className="sr-only">Stock changes, newest first</caption>
              <thead>
                <tr className="border-b-2 border-border">
                  <th scope="col" className="py-2 pr-2">
                    When
                  </th>
                  <th scope="col" className="py-2 pr-2">
                    Size
                  </th>
                  <th scope="col" className="py-2 pr-2 text-right">
                    Change
                  </th>
                  <th scope="col" className="py-2 pr-2 text-right">
                    After
                  </th>
                  <th scope="col" className="py-2">
                    Why
                  </th>
                </tr>
              </thead>
              <tbody>
                {[...history.data.changes].reverse().map((c, i) => (
                  <tr key={`${c.at}-${i}`} className="border-b border-border">
                    <td className="py-2 pr-2">{describeInstant(c.at, timeZone)}</td>
                    <td className="py-2 pr-2">{c.preySize}</td>
                    <td className="py-2 pr-2 text-right tabular-nums">
                      {c.delta > 0 ? `+${c.delta}` : c.delta}
                    </td>
                    <td className="py-2 pr-2 text-right tabular-nums">{c.after}</td>
                    <td className="py-2">
                      {REASON_WORDS[c.reason]}
                      {c.note && <span className="block text-sm text-muted">{c.note}</span>}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </details>
        )}
      </section>
      <section aria-labelledby="care-heading" className="flex flex-col gap-2">
        <h2 id="care-heading" className="text-xl font-extrabold">
          Care
        </h2>
        <dl className="grid grid-cols-2 gap-2">
          {COLONY_CARE_KINDS.map((k) => (
            <div key={k} className="rounded-xl border-2 border-border p-2">
              <dt className="font-bold">{COLONY_CARE_WORDS[k]}</dt>
              <dd>
                {colony.intervals[k] ? `Every ${colony.intervals[k]} days` : 'Not on the round'}
                <span className="block text-sm text-muted">
                  {colony.lastDone[k]
                    ? `Last ${formatLocalDate(colony.lastDone[k]!)}`
                    : 'Not done yet'}
                </span>
              </dd>
            </div>
          ))}
        </dl>
        {editing && rules.data ? (
          <ColonyForm
            feeders={rules.data.rules.feeders}
            initial={colony}
            busy={update.isPending}
            error={update.error?.message ?? null}
            submitLabel="Save colony"
            onSubmit={(body) =>
              update.mutate({ colonyId: colony.id, body }, { onSuccess: () => setEditing(false) })
            }
          />
        ) : (
          <Button variant="secondary" wide onClick={() => setEditing(true)}>
            Edit colony
          </Button>
        )}
        <Button
          variant="danger"
          wide
          busy={remove.isPending}
          onClick={() => {
            if (window.confirm(`Remove ${colony.name} and its stock history?`))
              remove.mutate(colony.id, { onSuccess: () => navigate('/colonies') });
          }}
        >
          Remove colony
        </Button>
        {remove.error && <Notice tone="error" title={remove.error.message} />}
      </section>
      <FeederSafety />
    </div>
  );
}
