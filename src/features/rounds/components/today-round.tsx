import { useCallback, useMemo, useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { EVENT_WORDS, type EventKind } from '#shared/domain/event-kinds';
import {
  clockTime,
  describeInstant,
  describeLocalDate,
  localDateOf,
} from '#shared/domain/local-dates';
import type { RecordedEvent } from '#shared/schemas/events';
import type { RoundItemView } from '#shared/schemas/rounds';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { ApiError } from '@/lib/api-client';
import type { UnsettledTap } from '@/lib/db';
import { useRound } from '../api/get-round';
import { sendOutcomePhoto } from '../api/outcome-photo';
import { useRecordMany, useRecordOutcome } from '../api/record-outcome';
import {
  filterItems,
  roundCounts,
  storedFilter,
  storeFilter,
  type RoundFilter,
} from '../filter-items';
import { OutcomeButtons } from './outcome-buttons';
import { OutcomePhotoStatus } from './outcome-photo-status';
import { ProgressBar } from './progress-bar';
import { RoundFilters } from './round-filters';
import { RoundList } from './round-list';
import { RoundUnavailable } from './round-unavailable';
import { TrayAtOnce } from './tray-at-once';
import { UndoToast } from './undo-toast';

type Animal = RoundItemView['animal'];

/** What the undo toast would take back: one tap, or a whole shelf saved at once. */
type LastTap =
  | { kind: 'one'; event: RecordedEvent; animal: Animal }
  | { kind: 'shelf'; label: string; taps: { event: RecordedEvent; animal: Animal }[] };

const browserStorage = () => (typeof localStorage === 'undefined' ? undefined : localStorage);

/** What the round offers a form for a molt just tapped (the form itself comes from outside). */
export interface MoltDetailsSlot {
  moltId: string;
  timeZone: string;
  /** Records the molt's details, or completes `completes` (an earlier molt of the same day). */
  onRecord: (payload: Record<string, unknown>, at: Date, completes?: string) => Promise<unknown>;
}

export interface TodayRoundProps {
  userId: string;
  myName: string;
  collectionId: string;
  /** More on each item, above its buttons (a helper's notes and cautions). */
  extras?: (item: RoundItemView) => ReactNode;
  /** The details form under a molt just tapped; keep it stable (useCallback), as `extras`. */
  moltDetails?: (slot: MoltDetailsSlot) => ReactNode;
  /** Link each card to its animal's page (keepers and owners; helpers may not open it). */
  openRecord?: boolean;
  /** Keep the engine's input so the phone can build the next days with no signal (keepers). */
  buildsOffline?: boolean;
  /** Offer a photo with an outcome (keepers and owners: photos are theirs to send and see). */
  photos?: boolean;
  /** Offer the outcomes only keepers may record (a rehouse). */
  keeper?: boolean;
}

/** Today's round at the rack: the phone's copy, one-tap outcomes, filters, trays and undo. */
export function TodayRound({
  userId,
  myName,
  collectionId,
  extras,
  moltDetails,
  openRecord,
  buildsOffline,
  photos,
  keeper,
}: TodayRoundProps) {
  const { local, server } = useRound(userId, collectionId, 'today', { buildsOffline });
  const timeZone = local.data?.round.timeZone ?? 'UTC';
  const record = useRecordOutcome({ userId, byName: myName, collectionId });
  const recordMany = useRecordMany({ userId, byName: myName, collectionId });
  const [filter, setFilterState] = useState<RoundFilter>(() => storedFilter(browserStorage()));
  // Cards finished since the filter was chosen: they stay (folded) under To do, see filterItems.
  const [kept, setKept] = useState<ReadonlySet<string>>(new Set());
  const keep = useCallback(
    (ids: string[]) => setKept((k) => (ids.every((id) => k.has(id)) ? k : new Set([...k, ...ids]))),
    [],
  );
  const setFilter = useCallback((f: RoundFilter) => {
    setFilterState(f);
    setKept(new Set());
    storeFilter(browserStorage(), f);
  }, []);
  const [search, setSearch] = useState('');
  const [last, setLast] = useState<LastTap | null>(null);
  const closeToast = useCallback(() => setLast(null), []);
  const recordShelf = useCallback(
    async (label: string, list: { animal: Animal; kind: EventKind }[]) => {
      const events = await recordMany(list);
      keep(list.map((l) => l.animal.id));
      setLast({
        kind: 'shelf',
        label,
        taps: events.map((event, i) => ({ event, animal: list[i]!.animal })),
      });
      return events;
    },
    [recordMany, keep],
  );
  const groupActions = useCallback(
    (label: string, list: RoundItemView[]) => (
      <TrayAtOnce key={label} label={label} items={list} onRecord={recordShelf} />
    ),
    [recordShelf],
  );
  const onPhoto = useCallback(
    (animalId: string, outcome: { eventId: string; word: string }, file: File) =>
      sendOutcomePhoto(collectionId, { ...outcome, animalId }, file),
    [collectionId],
  );
  const status = useCallback(
    (item: RoundItemView) => <OutcomePhotoStatus animalId={item.animal.id} />,
    [],
  );
  const onUndo = useCallback(
    (item: RoundItemView, eventId: string) =>
      void record(item.animal, 'void', { targetId: eventId }),
    [record],
  );
  const actions = useCallback(
    (item: RoundItemView) => (
      <>
        {extras?.(item)}
        <OutcomeButtons
          item={item}
          onRecord={(kind, payload) =>
            record(item.animal, kind, payload).then((event) => {
              keep([item.animal.id]);
              setLast({ kind: 'one', event, animal: item.animal });
              return event;
            })
          }
          onPhoto={photos ? (outcome, file) => onPhoto(item.animal.id, outcome, file) : undefined}
          keeper={keeper}
          moltDetails={
            moltDetails &&
            ((moltId) =>
              moltDetails({
                moltId,
                timeZone,
                onRecord: (payload, at, completes) =>
                  record(
                    item.animal,
                    'molt_details',
                    { targetId: completes ?? moltId, ...payload },
                    at,
                  ),
              }))
          }
        />
      </>
    ),
    [record, extras, moltDetails, timeZone, keep, photos, onPhoto, keeper],
  );
  const items = local.data?.round.items;
  const counts = useMemo(() => roundCounts(items ?? []), [items]);
  const shown = useMemo(
    () => filterItems(items ?? [], filter, search, kept),
    [items, filter, search, kept],
  );

  if (local.isPending || (!local.data && server.isPending))
    return <Loading label="Loading today’s round…" />;
  if (local.isError)
    return (
      <Notice
        tone="error"
        title="This phone’s storage could not be opened, so the round cannot be kept offline."
      />
    );
  if (!local.data) return <RoundUnavailable error={server.error} what="today’s round" />;

  const { round, fetchedAt, builtOnPhone, unsettled } = local.data;
  const today = localDateOf(new Date(), round.timeZone);
  // Undo goes through the void, as everywhere: the mistake and its correction both stay on record.
  const undo = (t: LastTap) =>
    void (t.kind === 'one'
      ? record(t.animal, 'void', { targetId: t.event.id })
      : recordMany(
          t.taps.map(({ event, animal }) => ({
            animal,
            kind: 'void' as const,
            payload: { targetId: event.id },
          })),
        ));
  const dataTime = describeInstant(fetchedAt, round.timeZone);

  return (
    <div className="flex flex-col gap-3">
      {round.date < today && (
        <Notice
          tone="warning"
          title={`Not today’s round: this is the round for ${describeLocalDate(round.date)}.`}
        >
          Today’s round comes with the next signal. Taps made now are still saved with their time
          and count on the day they were made.
        </Notice>
      )}
      {builtOnPhone && round.date === today && (
        <Notice tone="info" title="Built on this phone">
          Worked out here from the records this phone had on {dataTime} and the taps made since. The
          server’s round takes its place with the next signal; taps made on this one are kept.
        </Notice>
      )}
      {unsettled && unsettled.length > 0 && (
        <UnsettledTaps taps={unsettled} zone={round.timeZone} />
      )}
      {server.isError && (
        <p className="text-sm font-bold text-muted">
          {server.error instanceof ApiError && server.error.status === 0
            ? 'No signal'
            : server.error.message}{' '}
          · showing this phone’s copy {builtOnPhone ? 'built from records of' : 'from'} {dataTime}
        </p>
      )}
      <ProgressBar counts={counts} />
      <RoundFilters
        filter={filter}
        onFilter={setFilter}
        search={search}
        onSearch={setSearch}
        counts={counts.cards}
      />
      <Link
        to="/today/checklist"
        className="inline-flex min-h-target items-center self-start rounded-xl px-1 font-bold underline underline-offset-4"
      >
        Print a checklist of this round
      </Link>
      <RoundList
        items={shown}
        timeZone={round.timeZone}
        myName={myName}
        empty={
          round.items.length ? 'Nothing here with this filter.' : 'Nothing is due. Enjoy the quiet.'
        }
        actions={actions}
        groupActions={filter === 'done' ? undefined : groupActions}
        status={status}
        onUndo={onUndo}
        openRecord={openRecord}
        fold
      />
      {last && (
        <UndoToast
          message={
            last.kind === 'one'
              ? `${EVENT_WORDS[last.event.kind]} · ${last.animal.name} (${last.animal.labelCode})`
              : `${last.taps.length} saved on ${last.label}`
          }
          onUndo={() => undo(last)}
          onClose={closeToast}
        />
      )}
    </div>
  );
}

/**
 * Taps this phone showed on its own round that the server's round for the day has no place for
 * (an animal it does not list today, a tap it refused): said plainly, never dropped in silence.
 */
function UnsettledTaps({ taps, zone }: { taps: UnsettledTap[]; zone: string }) {
  return (
    <Notice tone="warning" title="Recorded on this phone, not on the server’s round">
      <p>
        The server’s round for today has no card for these taps. Each is in its animal’s history, or
        under “Needs attention” if the server refused it.
      </p>
      <ul className="mt-1 list-disc pl-5">
        {taps.map((t) => (
          <li key={t.eventId}>
            {EVENT_WORDS[t.kind]} · {t.animalName} ({t.labelCode}) · {clockTime(t.at, zone)}
          </li>
        ))}
      </ul>
    </Notice>
  );
}
