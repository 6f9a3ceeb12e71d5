import { useId, useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { EVENT_WORDS, type EventKind } from '#shared/domain/event-kinds';
import { feedHoldOf } from '#shared/domain/rounds/item-status';
import type { RoundItemView } from '#shared/schemas/rounds';
import { Button } from '@/components/ui/button';
import { TextAreaField } from '@/components/ui/text-area-field';

/**
 * Records one outcome; today's round answers with the recorded event (its id) once it is on
 * the phone, which a photo needs. Elsewhere (a scanned label) nothing comes back.
 */
export type RecordOutcome = (
  kind: EventKind,
  payload?: Record<string, unknown>,
) => Promise<{ id: string }> | void;

/** The same limit as the event's own `note` (shared/schemas/events.ts). */
const NOTE_MAX = 2000;

/** Everything that can be recorded in one tap, for an animal that is not on today's round. */
const ANY_DAY: EventKind[] = ['ate', 'refused', 'prey_left_in', 'prey_removed', 'watered'];

interface Outcome {
  kind: EventKind;
  word: string;
  payload?: Record<string, unknown>;
}
const outcome = (kind: EventKind): Outcome => ({ kind, word: EVENT_WORDS[kind] });

/** A larva's substrate check is done by looking and topping up: one tap writes that note. */
const SUBSTRATE_CHECKED: Outcome = {
  kind: 'note',
  word: 'Checked',
  payload: { text: 'Checked the food substrate and topped it up.' },
};

/** The one-tap outcomes an item's tasks call for; the rest sit one step away under "More". */
function mainOutcomes(item: RoundItemView, held: boolean, canRehouse: boolean): Outcome[] {
  if (!item.tasks.length) return (held ? ANY_DAY.filter((k) => k !== 'ate') : ANY_DAY).map(outcome);
  // A task a hold withdrew offers no buttons: there is nothing to do for it today.
  const open = item.tasks.filter((t) => !t.withdrawn);
  const kinds = new Set(open.map((t) => t.kind));
  const codes = new Set(open.flatMap((t) => t.reasons.map((r) => r.code)));
  const preyInside =
    kinds.has('remove_prey') || item.outcomes.some((o) => o.kind === 'prey_left_in');
  const list: EventKind[] = [];
  if (kinds.has('feed')) list.push('ate', 'refused', 'prey_left_in');
  // A roach allowed to stay is checked (R20): it may be gone — eaten — or taken out.
  else if (codes.has('check_prey')) list.push('ate');
  if (preyInside) list.push('prey_removed');
  if (kinds.has('water')) list.push('watered');
  if (kinds.has('mist')) list.push('misted');
  if (kinds.has('moisten')) list.push('substrate_moistened');
  if (kinds.has('spot_clean')) list.push('spot_cleaned');
  // Rehousing stays with keepers: a helper's round never offers it (HELPER_EVENT_KINDS).
  if (kinds.has('rehouse') && canRehouse) list.push('rehoused');
  return [...list.map(outcome), ...(codes.has('check_substrate') ? [SUBSTRATE_CHECKED] : [])];
}

const MORE: EventKind[] = ['molted', 'premolt_seen', 'molting_now', 'skipped'];

/**
 * Feeding a held animal (a molt hold, premolt, a do-not-feed note…) takes a deliberate second
 * step that says why it is held (R18); the meal is then recorded, and the server flags it.
 */
function HeldMealConfirm({
  reason,
  onConfirm,
  onCancel,
}: {
  reason: string;
  onConfirm: () => void;
  onCancel: () => void;
}) {
  return (
    <div
      role="alertdialog"
      aria-label="Food is held back"
      className="flex flex-col gap-2 rounded-xl border-2 border-danger p-2"
    >
      <p className="font-extrabold text-danger">Food is held back for this animal.</p>
      <p className="font-bold">{reason}</p>
      <p className="text-sm">
        Record a meal anyway only if it really ate. The owner will see it flagged.
      </p>
      <div className="grid grid-cols-2 gap-2">
        <Button variant="danger" className="min-h-14 px-2 text-base" onClick={onConfirm}>
          It ate anyway
        </Button>
        <Button variant="secondary" className="min-h-14 px-2 text-base" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </div>
  );
}

/** The photo to send with the next outcome: chosen from the camera or the phone's pictures. */
function PhotoPicker({ file, onFile }: { file: File | null; onFile: (f: File | null) => void }) {
  return (
    <div className="flex flex-wrap items-center gap-2">
      <label className="inline-flex min-h-target cursor-pointer items-center rounded-xl border-2 border-border px-3 font-bold has-[:focus-visible]:outline has-[:focus-visible]:outline-4">
        {file ? 'Change photo' : 'Add a photo'}
        <input
          type="file"
          accept="image/jpeg,image/png,image/webp"
          capture="environment"
          className="sr-only"
          onChange={(ev) => {
            onFile(ev.target.files?.[0] ?? null);
            ev.target.value = '';
          }}
        />
      </label>
      {file && (
        <>
          <span className="min-w-0 flex-1 truncate text-sm">{file.name}</span>
          <Button variant="quiet" className="text-base" onClick={() => onFile(null)}>
            Remove photo
          </Button>
        </>
      )}
    </div>
  );
}

interface Props {
  item: RoundItemView;
  onRecord: RecordOutcome;
  /** After Molted: a prompt to complete that same molt with its size, sex and photo. */
  moltDetails?: (moltEventId: string) => ReactNode;
  /** Sends a photo with a recorded outcome; absent where photos are not allowed (helpers). */
  onPhoto?: (outcome: { eventId: string; word: string }, file: File) => void;
  /** Offer "Rehoused" (keepers and owners: a helper may not record it, HELPER_EVENT_KINDS). */
  keeper?: boolean;
}

export function OutcomeButtons({ item, onRecord, moltDetails, onPhoto, keeper = false }: Props) {
  const [open, setOpen] = useState(false);
  const [confirming, setConfirming] = useState(false);
  const [noteOpen, setNoteOpen] = useState(false);
  const [noteDraft, setNoteDraft] = useState('');
  const [photo, setPhoto] = useState<File | null>(null);
  const panelId = useId();
  const notePanelId = useId();
  const recorded = new Set<EventKind>(item.outcomes.map((o) => o.kind));
  const hold = feedHoldOf(item);
  const main = mainOutcomes(item, !!hold, keeper);
  // One molt a day: once it is recorded, its details are completed instead.
  const more = (hold ? (['ate', ...MORE] as EventKind[]) : MORE).filter(
    (k) => k !== 'molted' || !recorded.has('molted'),
  );
  /**
   * Records an outcome with what was written in the note panel: the note goes in the event's own
   * data (queued on the phone like any tap, so it works with no signal); a photo follows once
   * the event has reached the server.
   */
  const send = (
    kind: EventKind,
    payload: Record<string, unknown> = {},
    word = EVENT_WORDS[kind],
  ) => {
    const note = noteDraft.trim();
    const withNote = !note
      ? payload
      : kind === 'note'
        ? { text: [payload.text, note].filter(Boolean).join(' ') }
        : { ...payload, note };
    const recorded = onRecord(kind, withNote);
    const file = photo;
    if (note || file) {
      setNoteDraft('');
      setPhoto(null);
      setNoteOpen(false);
    }
    if (file && onPhoto && recorded)
      void recorded.then((event) => onPhoto({ eventId: event.id, word }, file));
  };
  const tap = (kind: EventKind, payload?: Record<string, unknown>, word?: string) => {
    if (kind === 'ate' && hold) setConfirming(true);
    else send(kind, payload, word);
  };
  const drafting = noteDraft.trim() !== '' || photo !== null;
  const molt = item.outcomes.find((o) => o.kind === 'molted');
  const detailed = item.outcomes.some((o) => o.kind === 'molt_details');
  return (
    <div className="flex flex-col gap-2">
      {molt && !detailed && moltDetails?.(molt.eventId)}
      {keeper && recorded.has('rehoused') && (
        // The tap stays one tap; the new enclosure's size goes on the record (R22) when measured.
        <Link
          to={`/animals/${item.animal.id}/edit`}
          className="inline-flex min-h-target items-center self-start rounded-xl px-2 font-bold underline underline-offset-4"
        >
          Enter the new enclosure’s size<span className="sr-only"> for {item.animal.name}</span>
        </Link>
      )}
      {confirming && hold && (
        <HeldMealConfirm
          reason={hold.text}
          onConfirm={() => {
            setConfirming(false);
            send('ate');
          }}
          onCancel={() => setConfirming(false)}
        />
      )}
      <div className="grid grid-cols-2 gap-2 min-[400px]:grid-cols-3">
        {main.map(({ kind, word, payload }) => (
          <Button
            key={word}
            variant={recorded.has(kind) ? 'primary' : 'secondary'}
            className="min-h-14 px-2 text-base"
            onClick={() => tap(kind, payload, word)}
          >
            {word}
          </Button>
        ))}
        <Button
          variant={drafting ? 'primary' : 'quiet'}
          aria-expanded={noteOpen}
          aria-controls={notePanelId}
          className="min-h-14 px-2 text-base"
          onClick={() => setNoteOpen((o) => !o)}
        >
          {onPhoto ? 'Note or photo' : 'Add a note'}
          {drafting && !noteOpen && <span className="sr-only"> (written, not saved yet)</span>}
        </Button>
        <Button
          variant="quiet"
          aria-expanded={open}
          aria-controls={panelId}
          className="min-h-14 px-2 text-base"
          onClick={() => setOpen((o) => !o)}
        >
          {open ? 'Less' : 'More…'}
        </Button>
      </div>
      {noteOpen && (
        <div id={notePanelId} className="flex flex-col gap-2 rounded-xl border-2 border-border p-2">
          <TextAreaField
            label={`Note for ${item.animal.name}`}
            hint="Then tap the outcome: the note is saved with it, with or without a signal."
            maxLength={NOTE_MAX}
            rows={2}
            value={noteDraft}
            onChange={(e) => setNoteDraft(e.target.value)}
          />
          {onPhoto && (
            <>
              <PhotoPicker file={photo} onFile={setPhoto} />
              <p className="text-sm text-muted">
                A photo is not kept on the phone: it is sent once the outcome has reached Rackside,
                so it needs a signal and this page left open until then. Without one, add it later
                from the animal’s timeline.
              </p>
            </>
          )}
          <Button
            variant="secondary"
            disabled={!noteDraft.trim()}
            className="min-h-14 px-2 text-base"
            onClick={() => send('note', {}, 'Note')}
          >
            Save as a note on its own
          </Button>
        </div>
      )}
      {open && (
        <div id={panelId} className="flex flex-col gap-2 rounded-xl border-2 border-border p-2">
          <div className="grid grid-cols-2 gap-2">
            {more.map((kind) => (
              <Button
                key={kind}
                variant="secondary"
                className="min-h-14 px-2 text-base"
                onClick={() => tap(kind)}
              >
                {kind === 'ate' ? 'Ate anyway…' : EVENT_WORDS[kind]}
              </Button>
            ))}
          </div>
        </div>
      )}
    </div>
  );
}
