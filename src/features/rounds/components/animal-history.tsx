import type { ReactNode } from 'react';
import { useState } from 'react';
import { EVENT_WORDS, FED_WHILE_HELD, type EventKind } from '#shared/domain/event-kinds';
import { describeInstant } from '#shared/domain/local-dates';
import { UNDO_EFFECTS, undoNeedsConfirmation } from '#shared/domain/undo';
import { SERVER_EVENT_KINDS, type HistoryEvent } from '#shared/schemas/events';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { useAnimalHistory } from '../api/animal-history';
import { useRecordOutcome, type Recorder } from '../api/record-outcome';
import { eventPhotoPath, useUploadMoltPhoto } from '../api/upload-molt-photo';

function detail(e: HistoryEvent): string | null {
  const p = e.payload as {
    text?: string;
    note?: string;
    sizeMm?: number;
    to?: string;
    rehoused?: boolean;
  };
  const status = e.kind === 'status_changed' && p.to ? `now ${p.to.replace('_', ' ')}` : null;
  const rehoused = e.kind === 'moved' && p.rehoused ? 'into a new enclosure' : null;
  return (
    [status, rehoused, p.text ?? p.note ?? (p.sizeMm ? `${p.sizeMm} mm` : null)]
      .filter(Boolean)
      .join(' · ') || null
  );
}

/**
 * Where a photo is offered: a molt's at any time; another outcome's or note's for a week (a
 * photo taken at the rack with no signal is added here later), and wherever one is already.
 */
const PHOTO_DAYS_MS = 7 * 86_400_000;
const photoFits = (e: HistoryEvent) =>
  e.kind === 'molted' ||
  !!e.photoVersion ||
  (e.kind !== 'void' &&
    !SERVER_EVENT_KINDS.includes(e.kind) &&
    Date.now() - Date.parse(e.at) < PHOTO_DAYS_MS);

/** The timeline's filter: what kind of facts to show. */
const KIND_GROUPS = {
  all: null,
  feeding: ['ate', 'refused', 'prey_left_in', 'prey_removed', 'skipped'],
  molts: ['molted', 'molt_details', 'premolt_seen', 'premolt_cleared', 'molting_now'],
  water: ['watered', 'misted', 'substrate_moistened'],
  enclosure: ['spot_cleaned', 'rehoused'],
  notes: ['note'],
  moves: ['moved', 'status_changed'],
} satisfies Record<string, EventKind[] | null>;
type KindGroup = keyof typeof KIND_GROUPS;
const GROUP_WORDS: Record<KindGroup, string> = {
  all: 'All',
  feeding: 'Feeding',
  molts: 'Molts',
  water: 'Water',
  enclosure: 'Enclosure',
  notes: 'Notes',
  moves: 'Moves',
};

/** A fact's photo (a molt's exuviae, what an outcome showed), and a way to add or change it. */
function MoltPhoto({
  collectionId,
  animalId,
  event,
}: {
  collectionId: string;
  animalId: string;
  event: HistoryEvent;
}) {
  const url = `/api${eventPhotoPath(collectionId, animalId, event)}`;
  const upload = useUploadMoltPhoto(collectionId, animalId, event);
  const what =
    event.kind === 'molted' ? 'The molt’s exuviae' : `Photo with ${EVENT_WORDS[event.kind]}`;
  return (
    <div className="mt-1 flex items-center gap-2">
      {event.photoVersion && (
        <img
          src={`${url}?size=thumb&v=${encodeURIComponent(event.photoVersion)}`}
          alt={what}
          className="h-16 w-16 rounded-lg object-cover"
        />
      )}
      <label className="inline-flex min-h-target cursor-pointer items-center rounded-xl border-2 border-border px-3 font-bold has-[:focus-visible]:outline has-[:focus-visible]:outline-4">
        {upload.isPending ? 'Sending…' : event.photoVersion ? 'Change photo' : 'Add photo'}
        <input
          type="file"
          accept="image/jpeg,image/png,image/webp"
          className="sr-only"
          aria-label={`${what}, ${event.at.slice(0, 10)}`}
          onChange={(ev) => {
            const file = ev.target.files?.[0];
            if (file) upload.mutate(file);
            ev.target.value = '';
          }}
        />
      </label>
      {upload.isError && (
        <span className="text-sm font-bold text-danger">{upload.error.message}</span>
      )}
    </div>
  );
}

/**
 * The animal's recent facts. A mistaken one is undone by recording a void, so the history
 * keeps both the mistake and its correction.
 */
export function AnimalHistory({
  recorder,
  animal,
  timeZone,
  room,
}: {
  recorder: Recorder;
  animal: { id: string; name: string };
  timeZone: string;
  /** The room's climate, day by day (composed by the animal page: features stay apart). */
  room?: ReactNode;
}) {
  const when = (iso: string) => describeInstant(iso, timeZone);
  const history = useAnimalHistory(recorder.collectionId, animal.id);
  const record = useRecordOutcome(recorder);
  const [undone, setUndone] = useState<Set<string>>(new Set());
  /** The older fact whose undo waits for a confirmation (shared/domain/undo.ts says which). */
  const [confirming, setConfirming] = useState<string | null>(null);
  const undo = (id: string) =>
    void record(animal, 'void', { targetId: id }).then(() => {
      setUndone((s) => new Set(s).add(id));
      setConfirming(null);
    });
  const [group, setGroup] = useState<KindGroup>('all');
  const kinds: readonly EventKind[] | null = KIND_GROUPS[group];
  return (
    <section aria-labelledby="history-heading" className="flex flex-col gap-2">
      <h2 id="history-heading" className="text-xl font-extrabold">
        Timeline
      </h2>
      {history.isPending && <Loading />}
      {history.isError && <Notice tone="error" title={history.error.message} />}
      <ChoiceGroup
        legend="Show"
        legendHidden
        className="grid-cols-3"
        value={group}
        options={Object.keys(KIND_GROUPS) as KindGroup[]}
        onChange={setGroup}
        render={(g) => GROUP_WORDS[g]}
      />
      {room}
      {history.data && !history.data.events.length && (
        <p className="text-muted">Nothing recorded yet.</p>
      )}
      <ul className="flex flex-col gap-2">
        {history.data?.events
          .filter((e) => e.kind !== 'void' && (!kinds || kinds.includes(e.kind)))
          .map((e) => {
            const cancelled = !!e.voidedBy || undone.has(e.id);
            const older = undoNeedsConfirmation(e.at, new Date(), timeZone);
            return (
              <li
                key={e.id}
                className="flex flex-col gap-2 rounded-xl border-2 border-border bg-surface p-2"
              >
                <div className="flex items-center gap-2">
                  <div className="min-w-0 flex-1">
                    <p className={`font-bold ${cancelled ? 'line-through' : ''}`}>
                      {EVENT_WORDS[e.kind]}
                      {detail(e) && <span className="font-normal"> · {detail(e)}</span>}
                    </p>
                    <p className="text-sm text-muted">
                      {when(e.at)}
                      {e.by && ` · ${e.by}`}
                      {cancelled && ' · undone'}
                    </p>
                    {e.flags.includes(FED_WHILE_HELD) && !cancelled && (
                      <p className="font-bold text-danger">
                        <span aria-hidden="true">! </span>Fed while food was held back
                      </p>
                    )}
                    {!cancelled && photoFits(e) && (
                      <MoltPhoto
                        collectionId={recorder.collectionId}
                        animalId={animal.id}
                        event={e}
                      />
                    )}
                  </div>
                  {!cancelled &&
                    !SERVER_EVENT_KINDS.includes(e.kind) &&
                    e.kind !== 'void' &&
                    confirming !== e.id && (
                      <Button
                        variant="secondary"
                        aria-label={`Undo ${EVENT_WORDS[e.kind]}, ${when(e.at)}${older ? '…' : ''}`}
                        onClick={() => (older ? setConfirming(e.id) : undo(e.id))}
                      >
                        {older ? 'Undo…' : 'Undo'}
                      </Button>
                    )}
                </div>
                {confirming === e.id && e.kind !== 'void' && (
                  <div
                    role="group"
                    aria-label={`Undo ${EVENT_WORDS[e.kind]} from ${when(e.at)}?`}
                    className="flex flex-col gap-2 rounded-xl border-2 border-danger p-2"
                  >
                    <p className="font-bold">
                      Undo “{EVENT_WORDS[e.kind]}” from {when(e.at)}?
                    </p>
                    <p>{UNDO_EFFECTS[e.kind]} The entry stays in the timeline, crossed out.</p>
                    <div className="flex flex-wrap gap-2">
                      <Button variant="danger" onClick={() => undo(e.id)}>
                        Undo it
                      </Button>
                      <Button variant="secondary" onClick={() => setConfirming(null)}>
                        Keep it
                      </Button>
                    </div>
                  </div>
                )}
              </li>
            );
          })}
      </ul>
    </section>
  );
}
