import { useState } from 'react';
import { Link } from 'react-router-dom';
import {
  describeHumidityRange,
  describeTemperatureRange,
  targetsProblem,
} from '#shared/domain/climate/ranges';
import {
  formatHumidity,
  formatTemperature,
  humidityProblem,
  TEMPERATURE_SYMBOL,
  temperatureInUnit,
  temperatureToCelsius,
  type TemperatureUnit,
} from '#shared/domain/temperature';
import type { RoomTargetsBody } from '#shared/schemas/climate';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { TextField } from '@/components/ui/text-field';
import { useTemperatureUnit } from '@/lib/preferences';
import { useClimateRooms, useSetTargets } from '../api/climate-api';
import { typedNumber } from './climate-today';

const shown = (v: number | null, unit?: TemperatureUnit) =>
  v === null ? '' : String(unit ? temperatureInUnit(v, unit) : v);

/** One room's range, typed in the person's unit and stored in °C. */
function TargetsForm({
  collectionId,
  room,
  targets,
  unit,
  onDone,
}: {
  collectionId: string;
  room: string;
  targets: RoomTargetsBody;
  unit: TemperatureUnit;
  onDone: () => void;
}) {
  const [values, setValues] = useState({
    minC: shown(targets.minCelsius, unit),
    maxC: shown(targets.maxCelsius, unit),
    minH: shown(targets.minHumidity),
    maxH: shown(targets.maxHumidity),
  });
  const [problem, setProblem] = useState<string | null>(null);
  const save = useSetTargets(collectionId);
  const symbol = TEMPERATURE_SYMBOL[unit];
  const set = (k: keyof typeof values) => (e: React.ChangeEvent<HTMLInputElement>) =>
    setValues((v) => ({ ...v, [k]: e.target.value }));

  function submit() {
    const n = {
      minC: typedNumber(values.minC),
      maxC: typedNumber(values.maxC),
      minH: typedNumber(values.minH),
      maxH: typedNumber(values.maxH),
    };
    if (Object.values(n).some((v) => Number.isNaN(v)))
      return setProblem('Type numbers only, e.g. 24.5, or leave a field empty.');
    const humidityWords = [n.minH, n.maxH]
      .map((h) => (h === null ? null : humidityProblem(h)))
      .find(Boolean);
    if (humidityWords) return setProblem(humidityWords);
    const body = {
      minCelsius: n.minC === null ? null : temperatureToCelsius(n.minC, unit),
      maxCelsius: n.maxC === null ? null : temperatureToCelsius(n.maxC, unit),
      minHumidity: n.minH,
      maxHumidity: n.maxH,
    };
    const words = targetsProblem(body);
    if (words) return setProblem(words);
    setProblem(null);
    save.mutate({ room, ...body }, { onSuccess: onDone });
  }

  return (
    <form
      className="grid grid-cols-2 gap-2"
      aria-label={`Target range for ${room}`}
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      <TextField
        label={`Lowest (${symbol})`}
        inputMode="decimal"
        value={values.minC}
        onChange={set('minC')}
      />
      <TextField
        label={`Highest (${symbol})`}
        inputMode="decimal"
        value={values.maxC}
        onChange={set('maxC')}
      />
      <TextField
        label="Lowest humidity (%)"
        inputMode="decimal"
        value={values.minH}
        onChange={set('minH')}
      />
      <TextField
        label="Highest humidity (%)"
        inputMode="decimal"
        value={values.maxH}
        onChange={set('maxH')}
      />
      <p className="col-span-2 text-sm text-muted">
        Leave a field empty for no limit on that side.
      </p>
      {problem && (
        <div className="col-span-2">
          <Notice tone="error" title={problem} />
        </div>
      )}
      {save.isError && (
        <div className="col-span-2">
          <Notice tone="error" title={save.error.message} />
        </div>
      )}
      <Button type="submit" busy={save.isPending}>
        Save range
      </Button>
      <Button variant="secondary" onClick={onDone}>
        Cancel
      </Button>
    </form>
  );
}

/** Every room of the places with its target range and newest reading, in the person's unit. */
export function RoomTargets({ collectionId }: { collectionId: string }) {
  const rooms = useClimateRooms(collectionId);
  const [unit] = useTemperatureUnit();
  const [editing, setEditing] = useState<string | null>(null);
  if (rooms.isPending) return <Loading />;
  if (rooms.isError) return <Notice tone="error" title={rooms.error.message} />;
  if (!rooms.data.rooms.length)
    return <p className="text-muted">Add a place first: its room then gets a range here.</p>;
  return (
    <ul className="flex flex-col gap-2" aria-label="Rooms and their climate">
      {rooms.data.rooms.map(({ room, targets, latest }) => {
        const range = [describeTemperatureRange(targets, unit), describeHumidityRange(targets)]
          .filter(Boolean)
          .join(' · ');
        const newest = latest
          ? [
              latest.currentCelsius !== null
                ? formatTemperature(latest.currentCelsius, unit)
                : null,
              latest.minCelsius !== null
                ? `lowest ${formatTemperature(latest.minCelsius, unit)}`
                : null,
              latest.maxCelsius !== null
                ? `highest ${formatTemperature(latest.maxCelsius, unit)}`
                : null,
              latest.humidity !== null ? `humidity ${formatHumidity(latest.humidity)}` : null,
            ]
              .filter(Boolean)
              .join(' · ')
          : null;
        return (
          <li
            key={room}
            className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3"
          >
            <h3 className="text-lg font-extrabold">{room}</h3>
            <p>
              <span className="font-bold">Target: </span>
              {range || 'no range set'}
            </p>
            {newest && (
              <p>
                <span className="font-bold">Newest reading: </span>
                {newest}
              </p>
            )}
            {editing === room ? (
              <TargetsForm
                collectionId={collectionId}
                room={room}
                targets={targets}
                unit={unit}
                onDone={() => setEditing(null)}
              />
            ) : (
              <div className="flex flex-wrap gap-2">
                <Button variant="secondary" onClick={() => setEditing(room)}>
                  Set range
                </Button>
                <Link
                  to={`/climate?room=${encodeURIComponent(room)}`}
                  className="inline-flex min-h-target items-center rounded-xl border-2 border-border px-4 font-bold underline underline-offset-4"
                >
                  Chart and import
                </Link>
              </div>
            )}
          </li>
        );
      })}
    </ul>
  );
}
