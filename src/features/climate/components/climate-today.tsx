import { useState } from 'react';
import { describeRoomAlert, mergeRoomAlerts, roomAlerts } from '#shared/domain/climate/daily';
import {
  describeHumidityRange,
  describeTemperatureRange,
  type RoomTargets,
} from '#shared/domain/climate/ranges';
import { clockTime, localDateOf } from '#shared/domain/local-dates';
import {
  formatHumidity,
  formatTemperature,
  humidityProblem,
  TEMPERATURE_SYMBOL,
  temperatureToCelsius,
  type TemperatureUnit,
} from '#shared/domain/temperature';
import type { RoomReadingPayload } from '#shared/schemas/climate';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import type { ChoreEntry } from '@/lib/db';
import { useTemperatureUnit } from '@/lib/preferences';
import { useChoreRecorder, useChoresOn } from '@/lib/use-chores';
import { useClimateToday } from '../api/climate-api';

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
  room,
  targets,
  unit,
  onRecord,
}: {
  room: string;
  targets: RoomTargets;
  unit: TemperatureUnit;
  /** Records the reading on this phone (the chores outbox sends it). */
  onRecord: (payload: RoomReadingPayload) => Promise<void>;
}) {
  const [min, setMin] = useState('');
  const [max, setMax] = useState('');
  const [humidity, setHumidity] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const symbol = TEMPERATURE_SYMBOL[unit];
  const range = rangeWords(targets, unit);

  async function save() {
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
    setBusy(true);
    try {
      await onRecord({
        minCelsius: lo === null ? null : temperatureToCelsius(lo, unit),
        maxCelsius: hi === null ? null : temperatureToCelsius(hi, unit),
        humidity: rh,
      });
    } catch {
      setProblem('This phone could not keep the reading. Try again.');
    } finally {
      setBusy(false);
    }
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
          void save();
        }}
      >
        {field('Lowest', min, setMin, symbol)}
        {field('Highest', max, setMax, symbol)}
        {field('Humidity', humidity, setHumidity, '%')}
        <Button type="submit" wide className="col-span-3" busy={busy}>
          Save reading
        </Button>
      </form>
      {problem && <Notice tone="error" title={problem} />}
    </li>
  );
}

/** A reading done today on this phone: its values, and whether it has reached the server. */
function ReadingDone({
  entry,
  unit,
  timeZone,
}: {
  entry: ChoreEntry;
  unit: TemperatureUnit;
  timeZone: string;
}) {
  const p = entry.chore.payload as RoomReadingPayload;
  const values = [
    p.minCelsius !== null && `lowest ${formatTemperature(p.minCelsius, unit)}`,
    p.maxCelsius !== null && `highest ${formatTemperature(p.maxCelsius, unit)}`,
    p.humidity !== null && `humidity ${formatHumidity(p.humidity)}`,
  ].filter(Boolean);
  return (
    <li className="flex flex-col gap-1 rounded-2xl border-2 border-ok bg-surface p-3">
      <p className="flex items-start gap-2 font-extrabold text-ok">
        <span aria-hidden="true">✓</span>
        <span>Room climate · {entry.chore.subjectId}: reading done</span>
      </p>
      <p>
        {clockTime(entry.chore.clientRecordedAt, timeZone)} · {values.join(' · ')}
      </p>
      {entry.state === 'waiting' && (
        <p className="text-sm font-bold">Saved on this phone, waiting to send.</p>
      )}
    </li>
  );
}

/**
 * Room climate on Today: a high-contrast notice for every room out of range in the last day
 * (room, reading and range in the person's unit), one reading card per room still due, and the
 * readings done on this phone. A reading is a room chore (decision 020): kept on the phone at
 * once, sent by the sync engine, and its out-of-range notice shown from the typed values
 * before the server has it.
 */
export function ClimateToday({
  userId,
  collectionId,
  timeZone,
}: {
  userId: string;
  collectionId: string;
  timeZone: string;
}) {
  const today = useClimateToday(collectionId);
  const localDate = localDateOf(new Date(), timeZone);
  const chores = useChoresOn(collectionId, localDate);
  const { record, discard } = useChoreRecorder(userId, collectionId, localDate);
  const [unit] = useTemperatureUnit();
  if (!today.data) return null;
  const readings = (chores.data ?? []).filter((c) => c.chore.subjectKind === 'room');
  const refused = readings.filter((c) => c.state === 'refused');
  const doneHere = new Map(
    readings.filter((c) => c.state !== 'refused').map((c) => [c.chore.subjectId, c]),
  );
  const rooms = today.data.rooms;
  const due = rooms.filter((r) => r.due && !doneHere.has(r.room));
  // Readings the server's answer cannot hold yet: waiting ones, and those settled after it came.
  const fetchedAt = new Date(today.dataUpdatedAt).toISOString();
  const unseen = readings.filter(
    (c) => c.state === 'waiting' || (c.state === 'sent' && (c.settledAt ?? '') > fetchedAt),
  );
  const alerts = mergeRoomAlerts(
    today.data.alerts,
    roomAlerts(
      rooms.map(({ room, targets }) => ({
        room,
        targets,
        readings: unseen
          .filter((c) => c.chore.subjectId === room)
          .map((c) => ({
            ...(c.chore.payload as RoomReadingPayload),
            currentCelsius: null,
            takenAt: c.chore.clientRecordedAt,
          })),
      })),
    ),
  );
  return (
    <section aria-label="Room climate" className="flex flex-col gap-2">
      {alerts.length > 0 && (
        <div
          role="status"
          className="rounded-xl border-4 border-danger bg-surface p-3 text-text"
          data-testid="climate-alert"
        >
          <p className="flex items-start gap-2 text-lg font-extrabold text-danger">
            <span aria-hidden="true">⚠</span>
            <span>
              {alerts.length === 1
                ? 'A room is out of range'
                : `${alerts.length} rooms are out of range`}
            </span>
          </p>
          <ul className="mt-1 flex flex-col gap-1 font-bold">
            {alerts.map((a) => (
              <li key={a.room}>{describeRoomAlert(a, unit)}</li>
            ))}
          </ul>
        </div>
      )}
      {refused.map((r) => (
        <div key={r.id} role="alert" className="rounded-xl border-2 border-danger bg-surface p-3">
          <p className="font-bold text-danger">
            <span aria-hidden="true">⚠ </span>
            Not saved: the reading for {r.chore.subjectId}
          </p>
          <p>{r.message}</p>
          <Button variant="secondary" onClick={() => void discard(r.id)}>
            Discard
          </Button>
        </div>
      ))}
      {(due.length > 0 || doneHere.size > 0) && (
        <ul className="flex flex-col gap-2" aria-label="Room readings today">
          {due.map((r) => (
            <ReadingCard
              key={r.room}
              room={r.room}
              targets={r.targets}
              unit={unit}
              onRecord={(payload) => record('room', r.room, 'reading', payload)}
            />
          ))}
          {[...doneHere.values()].map((entry) => (
            <ReadingDone key={entry.id} entry={entry} unit={unit} timeZone={timeZone} />
          ))}
        </ul>
      )}
    </section>
  );
}
