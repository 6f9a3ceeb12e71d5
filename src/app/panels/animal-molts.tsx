import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { localDateOf } from '#shared/domain/local-dates';
import type { SizeUnit } from '#shared/domain/units';
import { MoltForm } from '@/features/breeding/components/molt-form';
import { useAnimalHistory } from '@/features/rounds/api/animal-history';
import { localRoundQueryOptions } from '@/features/rounds/api/get-round';
import { useRecordOutcome, type Recorder } from '@/features/rounds/api/record-outcome';

interface Props {
  recorder: Recorder;
  animal: { id: string; name: string };
  timeZone: string;
  unit: SizeUnit;
}

/**
 * An animal's molt form (breeding records) fed by the molts already on record (the rounds'
 * history, today's taps on this phone and this page's own), so a second molt on one day
 * completes the first instead.
 */
export function AnimalMolts({ recorder, animal, timeZone, unit }: Props) {
  const { userId, collectionId } = recorder;
  const history = useAnimalHistory(collectionId, animal.id);
  const localToday = useQuery(localRoundQueryOptions(userId, collectionId, 'today'));
  const record = useRecordOutcome(recorder);
  const [recentMolts, setRecentMolts] = useState<{ eventId: string; date: string }[]>([]);
  const today = localDateOf(new Date(), timeZone);
  const todayItem =
    localToday.data?.round.date === today
      ? localToday.data.round.items.find((i) => i.animal.id === animal.id)
      : undefined;
  const molts = [
    ...(history.data?.events ?? [])
      .filter((e) => e.kind === 'molted' && !e.voidedBy)
      .map((e) => ({ eventId: e.id, date: localDateOf(new Date(e.at), timeZone) })),
    ...(todayItem?.outcomes ?? [])
      .filter((o) => o.kind === 'molted')
      .map((o) => ({ eventId: o.eventId, date: today })),
    ...recentMolts,
  ];
  return (
    <MoltForm
      today={today}
      timeZone={timeZone}
      unit={unit}
      molts={molts}
      onRecord={async (payload, at, completes) => {
        const event = await record(
          animal,
          completes ? 'molt_details' : 'molted',
          completes ? { targetId: completes, ...payload } : payload,
          at,
        );
        if (!completes)
          setRecentMolts((m) => [...m, { eventId: event.id, date: localDateOf(at, timeZone) }]);
      }}
    />
  );
}
