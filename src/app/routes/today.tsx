import { lazy, Suspense, useCallback, useMemo, useState, type ReactNode } from 'react';
import { EVENT_WORDS } from '#shared/domain/event-kinds';
import { clockTime, describeLocalDate, localDateOf } from '#shared/domain/local-dates';
import type { RecordedEvent } from '#shared/schemas/events';
import type { RoundItemView } from '#shared/schemas/rounds';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { MoltForm } from '@/features/breeding/components/molt-form';
import { useRound } from '@/features/rounds/api/get-round';
import { useRecordMany, useRecordOutcome } from '@/features/rounds/api/record-outcome';
import { OutcomeButtons } from '@/features/rounds/components/outcome-buttons';
import { ProgressBar } from '@/features/rounds/components/progress-bar';
import { RoundFilters } from '@/features/rounds/components/round-filters';
import { RoundList } from '@/features/rounds/components/round-list';
import { RoundUnavailable } from '@/features/rounds/components/round-unavailable';
import { TrayAtOnce } from '@/features/rounds/components/tray-at-once';
import { UndoToast } from '@/features/rounds/components/undo-toast';
import { filterItems, ROUND_FILTERS, type RoundFilter } from '@/features/rounds/filter-items';
import { ApiError } from '@/lib/api-client';
import { useSizeUnit } from '@/lib/preferences';
import { useShell } from './shell';

// A helper's round adds the safety page, handover notes and cautions: loaded only for helpers.
const HelperToday = lazy(() => import('./helper-today').then((m) => ({ default: m.HelperToday })));

export function TodayRoute() {
  const { me, collection } = useShell();
  if (!collection) return <Notice tone="info" title="You are not in any collection yet." />;
  if (collection.role === 'helper') {
    return (
      <Suspense fallback={<Loading />}>
        <HelperToday />
      </Suspense>
    );
  }
  // The heading needs only the collection's zone, so it paints before the round is read (P2).
  return (
    <div className="flex flex-col gap-3">
      <h1 className="text-3xl font-extrabold">Today · {describeLocalDate(localDateOf(new Date(), collection.timeZone))}</h1>
      <TodayRound userId={me.user.id} myName={me.user.displayName} collectionId={collection.collectionId} />
    </div>
  );
}

interface LastTap {
  event: RecordedEvent;
  animal: { id: string; name: string; labelCode: string };
}

interface TodayRoundProps {
  userId: string;
  myName: string;
  collectionId: string;
  /** More on each item, above its buttons (a helper's notes and cautions). */
  extras?: (item: RoundItemView) => ReactNode;
}

export function TodayRound({ userId, myName, collectionId, extras }: TodayRoundProps) {
  const { local, server } = useRound(userId, collectionId, 'today');
  const [unit] = useSizeUnit();
  const timeZone = local.data?.round.timeZone ?? 'UTC';
  const record = useRecordOutcome({ userId, byName: myName, collectionId });
  const recordMany = useRecordMany({ userId, byName: myName, collectionId });
  const groupActions = useCallback(
    (label: string, list: RoundItemView[]) => <TrayAtOnce key={label} label={label} items={list} onRecord={recordMany} />,
    [recordMany],
  );
  const [filter, setFilter] = useState<RoundFilter>('all');
  const [search, setSearch] = useState('');
  const [last, setLast] = useState<LastTap | null>(null);
  const closeToast = useCallback(() => setLast(null), []);
  const actions = useCallback(
    (item: RoundItemView) => (
      <>
        {extras?.(item)}
        <OutcomeButtons
          item={item}
          onRecord={(kind, payload) => {
            void record(item.animal, kind, payload).then((event) => setLast({ event, animal: item.animal }));
          }}
          moltDetails={(moltId) => (
            <MoltForm
              compact
              today={localDateOf(new Date(), timeZone)}
              timeZone={timeZone}
              unit={unit}
              molts={[{ eventId: moltId, date: localDateOf(new Date(), timeZone) }]}
              onRecord={(payload, at, completes) => record(item.animal, 'molt_details', { targetId: completes ?? moltId, ...payload }, at)}
            />
          )}
        />
      </>
    ),
    [record, extras, timeZone, unit],
  );
  const items = local.data?.round.items;
  const counts = useMemo(
    () => Object.fromEntries(ROUND_FILTERS.map((f) => [f, items ? filterItems(items, f, '').length : 0])) as Record<RoundFilter, number>,
    [items],
  );

  if (local.isPending || (!local.data && server.isPending)) return <Loading label="Loading today’s round…" />;
  if (local.isError) return <Notice tone="error" title="This phone’s storage could not be opened, so the round cannot be kept offline." />;
  if (!local.data) return <RoundUnavailable error={server.error} what="today’s round" />;

  const { round, fetchedAt } = local.data;
  const today = localDateOf(new Date(), round.timeZone);
  const undo = (t: LastTap) => void record(t.animal, 'void', { targetId: t.event.id });

  return (
    <div className="flex flex-col gap-3">
      {round.date < today && (
        <Notice tone="warning" title={`This is the round for ${describeLocalDate(round.date)}.`}>
          Today’s round comes with the next signal. Taps made now are still saved with their time.
        </Notice>
      )}
      {server.isError && (
        <p className="text-sm font-bold text-muted">
          {server.error instanceof ApiError && server.error.status === 0 ? 'No signal' : server.error.message} · showing this phone’s copy from {clockTime(fetchedAt, round.timeZone)}
        </p>
      )}
      <ProgressBar done={round.progress.done} total={round.progress.total} />
      <RoundFilters filter={filter} onFilter={setFilter} search={search} onSearch={setSearch} counts={counts} />
      <RoundList
        items={filterItems(round.items, filter, search)}
        timeZone={round.timeZone}
        myName={myName}
        empty={round.items.length ? 'Nothing here with this filter.' : 'Nothing is due. Enjoy the quiet.'}
        actions={actions}
        groupActions={filter === 'done' ? undefined : groupActions}
      />
      {last && (
        <UndoToast
          message={`${EVENT_WORDS[last.event.kind]} · ${last.animal.name} (${last.animal.labelCode})`}
          onUndo={() => undo(last)}
          onClose={closeToast}
        />
      )}
    </div>
  );
}
