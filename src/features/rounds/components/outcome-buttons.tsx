import { lazy, Suspense, useId, useState, type ReactNode } from 'react';
import { EVENT_WORDS, type EventKind } from '#shared/domain/event-kinds';
import { feedHoldOf } from '#shared/domain/rounds/item-status';
import type { RoundItemView } from '#shared/schemas/rounds';
import { Button } from '@/components/ui/button';
import { Loading } from '@/components/ui/spinner';

// The note form (and its checks) loads when "More…" is first opened, from the service worker's
// cache when offline, so the round's first bundle stays small (P4).
const NoteForm = lazy(() => import('./note-form').then((m) => ({ default: m.NoteForm })));

export type RecordOutcome = (kind: EventKind, payload?: Record<string, unknown>) => void;

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
function mainOutcomes(item: RoundItemView, held: boolean): Outcome[] {
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

interface Props {
  item: RoundItemView;
  onRecord: RecordOutcome;
  /** After Molted: a prompt to complete that same molt with its size, sex and photo. */
  moltDetails?: (moltEventId: string) => ReactNode;
}

export function OutcomeButtons({ item, onRecord, moltDetails }: Props) {
  const [open, setOpen] = useState(false);
  const [confirming, setConfirming] = useState(false);
  const [noteDraft, setNoteDraft] = useState('');
  const panelId = useId();
  const recorded = new Set<EventKind>(item.outcomes.map((o) => o.kind));
  const hold = feedHoldOf(item);
  const main = mainOutcomes(item, !!hold);
  // One molt a day: once it is recorded, its details are completed instead.
  const more = (hold ? (['ate', ...MORE] as EventKind[]) : MORE).filter(
    (k) => k !== 'molted' || !recorded.has('molted'),
  );
  const tap = (kind: EventKind, payload?: Record<string, unknown>) => {
    if (kind === 'ate' && hold) setConfirming(true);
    else onRecord(kind, payload);
  };
  const molt = item.outcomes.find((o) => o.kind === 'molted');
  const detailed = item.outcomes.some((o) => o.kind === 'molt_details');
  return (
    <div className="flex flex-col gap-2">
      {molt && !detailed && moltDetails?.(molt.eventId)}
      {confirming && hold && (
        <HeldMealConfirm
          reason={hold.text}
          onConfirm={() => {
            setConfirming(false);
            onRecord('ate');
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
            onClick={() => tap(kind, payload)}
          >
            {word}
          </Button>
        ))}
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
          <Suspense fallback={<Loading />}>
            <NoteForm
              animalName={item.animal.name}
              draft={noteDraft}
              onDraft={setNoteDraft}
              onNote={(payload) => onRecord('note', payload)}
            />
          </Suspense>
        </div>
      )}
    </div>
  );
}
