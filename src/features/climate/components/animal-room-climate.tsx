import { useState } from 'react';
import { dayOutOfRange, describeDay } from '#shared/domain/climate/daily';
import { formatLocalDate } from '#shared/domain/date-words';
import type { TemperatureUnit } from '#shared/domain/temperature';
import { Button } from '@/components/ui/button';
import { useAnimalClimate } from '../api/climate-api';

const SHOWN = 3;

/**
 * The animal's room on its timeline: one line per day (a logger's hundreds of rows summed up),
 * newest first, a day that left the room's range marked in words as well as colour.
 */
export function AnimalRoomClimate({
  collectionId,
  animalId,
  unit,
}: {
  collectionId: string;
  animalId: string;
  unit: TemperatureUnit;
}) {
  const climate = useAnimalClimate(collectionId, animalId);
  const [all, setAll] = useState(false);
  if (!climate.data?.room || !climate.data.days.length) return null;
  const { room, targets, days } = climate.data;
  const newest = [...days].reverse();
  const shown = all ? newest : newest.slice(0, SHOWN);
  return (
    <div className="flex flex-col gap-1 rounded-xl border-2 border-border bg-surface p-2">
      <p className="font-bold">Room climate · {room}</p>
      <ul className="flex flex-col gap-1" aria-label={`Climate of ${room}, day by day`}>
        {shown.map((d) => {
          const out = !!targets && dayOutOfRange(d, targets);
          return (
            <li key={d.date} className={out ? 'font-bold text-danger' : ''}>
              {formatLocalDate(d.date, undefined, { weekday: false })}: {describeDay(d, unit)}
              {out && ' · out of range'}
            </li>
          );
        })}
      </ul>
      {days.length > SHOWN && (
        <Button variant="quiet" onClick={() => setAll((a) => !a)}>
          {all ? 'Show fewer days' : `Show all ${days.length} days`}
        </Button>
      )}
    </div>
  );
}
