import { useCallback } from 'react';
import { localDateOf } from '#shared/domain/local-dates';
import { MoltForm } from '@/features/breeding/components/molt-form';
import {
  TodayRound,
  type MoltDetailsSlot,
  type TodayRoundProps,
} from '@/features/rounds/components/today-round';
import { useSizeUnit } from '@/lib/preferences';

/** Today's round (rounds) with the molt-details form (breeding records) under a fresh molt. */
export function TodayRoundPanel(props: Omit<TodayRoundProps, 'moltDetails'>) {
  const [unit] = useSizeUnit();
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
  return <TodayRound {...props} moltDetails={moltDetails} />;
}
