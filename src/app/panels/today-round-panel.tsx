import { useCallback } from 'react';
import { localDateOf } from '#shared/domain/local-dates';
import { Loading } from '@/components/ui/spinner';
import { useAnimalList } from '@/features/animals/api/list-animals';
import { FirstRunGuide } from '@/features/animals/components/first-run-guide';
import { MoltForm } from '@/features/breeding/components/molt-form';
import { useRound } from '@/features/rounds/api/get-round';
import {
  TodayRound,
  type MoltDetailsSlot,
  type TodayRoundProps,
} from '@/features/rounds/components/today-round';
import { useSizeUnit } from '@/lib/preferences';

/**
 * Today's round (rounds) with the molt-details form (breeding records) under a fresh molt; a
 * collection with no animals at all (animals) gets the first-run guide instead of an empty round.
 */
export function TodayRoundPanel({
  collectionName,
  ...props
}: Omit<TodayRoundProps, 'moltDetails'> & {
  /** Keepers' and owners' view: an empty collection gets the guide (helpers never list animals). */
  collectionName?: string;
}) {
  const [unit] = useSizeUnit();
  const { local } = useRound(props.userId, props.collectionId, 'today');
  const emptyRound = collectionName !== undefined && local.data?.round.items.length === 0;
  // The animal list is asked for only when the round is empty (it is usually cached anyway).
  const list = useAnimalList(props.collectionId, emptyRound);
  const moltDetails = useCallback(
    ({ moltId, timeZone, onRecord }: MoltDetailsSlot) => (
      <MoltForm
        compact
        today={localDateOf(new Date(), timeZone)}
        timeZone={timeZone}
        unit={unit}
        molts={[{ eventId: moltId, date: localDateOf(new Date(), timeZone) }]}
        onRecord={onRecord}
      />
    ),
    [unit],
  );
  if (emptyRound && list.isPending) return <Loading />;
  if (emptyRound && list.data?.animals.length === 0)
    return <FirstRunGuide collectionName={collectionName!} />;
  return <TodayRound {...props} moltDetails={moltDetails} />;
}
