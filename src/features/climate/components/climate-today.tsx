import { useState } from 'react';
import { describeRoomAlert } from '#shared/domain/climate/daily';
import {
  breachesOf,
  describeBreach,
  describeHumidityRange,
  describeTemperatureRange,
  type RoomTargets,
} from '#shared/domain/climate/ranges';
import {
  humidityProblem,
  TEMPERATURE_SYMBOL,
  temperatureToCelsius,
  type TemperatureUnit,
} from '#shared/domain/temperature';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { useTemperatureUnit } from '@/lib/preferences';
import { useClimateToday } from '../api/climate-api';
import { notSaved, useRecordReading } from '../api/record-reading';

/** "24,5" or "24.5" as a number; null for an empty field; NaN for anything else. */
export function typedNumber(text: string): number | null {
  const t = text.trim().replace(',', '.');
  if (!t) return null;
  return /^[+-−]?\d+(\.\d+)?$/.test(t) ? Number(t.replace('−', '-')) : Number.NaN;
}

function rangeWords(t: RoomTargets, unit: TemperatureUnit) {
  return [describeTemperatureRange(t, unit), describeHumidityRange(t)].filter(Boolean).join(' · ');
}

/** The day's reading of one room in one line: lowest and highest since the last, humidity now. */
function ReadingCard({
  collectionId,
  room,
  targets,
  unit,
  onSaved,
}: {
  collectionId: string;
  room: string;
  targets: RoomTargets;
  unit: TemperatureUnit;
  /** Told what was saved, in words: the card leaves Today once the day's reading is in. */
  onSaved: (words: string) => void;
}) {
  const [min, setMin] = useState('');
  const [max, setMax] = useState('');
  const [humidity, setHumidity] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const record = useRecordReading(collectionId);
  const symbol = TEMPERATURE_SYMBOL[unit];
  const range = rangeWords(targets, unit);

  function save() {
    const [lo, hi, rh] = [typedNumber(min), typedNumber(max), typedNumber(humidity)];
    if ([lo, hi, rh].some((v) => Number.isNaN(v)))
      return setProblem('Type numbers only, e.g. 24.5.');
    if (lo === null && hi === null && rh === null)
      return setProblem('Type a temperature or the humidity.');
    if (lo !== null && hi !== null && lo > hi)
      return setProblem('The lowest is above the highest. Swap them.');
    const rhWords = rh === null ? null : humidityProblem(rh);
    if (rhWords) return setProblem(rhWords);
    setProblem(null);
    record.mutate(
      {
        id: crypto.randomUUID(),
        room,
        minCelsius: lo === null ? null : temperatureToCelsius(lo, unit),
        maxCelsius: hi === null ? null : temperatureToCelsius(hi, unit),
        humidity: rh,
      },
      {
        onSuccess: ({ reading }) => {
          const broken = breachesOf(reading, targets);
          onSaved(
            broken.length
              ? `${room}: reading saved — ${broken.map((b) => describeBreach(b, targets, unit)).join('; ')}.`
              : `${room}: reading saved, within the range.`,
          );
        },
      },
    );
  }

  const field = (label: string, value: string, set: (v: string) => void, suffix: string) => (
    <label className="flex min-w-0 flex-col gap-1 text-sm font-bold">
      <span>
        {label} <span className="font-normal">({suffix})</span>
      </span>
      <input
        inputMode="decimal"
        autoComplete="off"
        value={value}
        onChange={(e) => set(e.target.value)}
        className="min-h-target w-full min-w-0 rounded-xl border-2 border-border bg-surface px-2 text-xl text-text"
      />
    </label>
  );

  return (
    <li className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3">
      <p className="font-extrabold">
        Room climate · {room}
        {range && <span className="block text-sm font-normal text-muted">Target {range}</span>}
      </p>
      <p className="text-sm text-muted">Lowest and highest since the last reading, humidity now.</p>
      <form
        className="grid grid-cols-3 gap-2"
        aria-label={`Climate reading for ${room}`}
        onSubmit={(e) => {
          e.preventDefault();
          save();
        }}
      >
        {field('Lowest', min, setMin, symbol)}
        {field('Highest', max, setMax, symbol)}
        {field('Humidity', humidity, setHumidity, '%')}
        <Button type="submit" wide className="col-span-3" busy={record.isPending}>
          Save reading
        </Button>
      </form>
      {problem && <Notice tone="error" title={problem} />}
      {record.isError && (
        <Notice
          tone="error"
          title={
            notSaved(record.error)
              ? 'Not saved: there is no connection. Type the reading again when you have signal.'
              : `Not saved: ${record.error.message}`
          }
        />
      )}
    </li>
  );
}

/**
 * Room climate on Today: a high-contrast notice for every room out of range in the last day
 * (room, reading and range in the person's unit), and one reading card per room still due.
 */
export function ClimateToday({ collectionId }: { collectionId: string }) {
  const today = useClimateToday(collectionId);
  const [unit] = useTemperatureUnit();
  const [saved, setSaved] = useState<string[]>([]);
  if (!today.data) return null;
  const due = today.data.rooms.filter((r) => r.due);
  return (
    <section aria-label="Room climate" className="flex flex-col gap-2">
      {today.data.alerts.length > 0 && (
        <div
          role="status"
          className="rounded-xl border-4 border-danger bg-surface p-3 text-text"
          data-testid="climate-alert"
        >
          <p className="flex items-start gap-2 text-lg font-extrabold text-danger">
            <span aria-hidden="true">⚠</span>
            <span>
              {today.data.alerts.length === 1
                ? 'A room is out of range'
                : `${today.data.alerts.length} rooms are out of range`}
            </span>
          </p>
          <ul className="mt-1 flex flex-col gap-1 font-bold">
            {today.data.alerts.map((a) => (
              <li key={a.room}>{describeRoomAlert(a, unit)}</li>
            ))}
          </ul>
        </div>
      )}
      {due.length > 0 && (
        <ul className="flex flex-col gap-2" aria-label="Room readings due today">
          {due.map((r) => (
            <ReadingCard
              key={r.room}
              collectionId={collectionId}
              room={r.room}
              targets={r.targets}
              unit={unit}
              onSaved={(words) => setSaved((list) => [...list, words])}
            />
          ))}
        </ul>
      )}
      {saved.map((text) => (
        <Notice key={text} tone="ok" title={text} />
      ))}
    </section>
  );
}
