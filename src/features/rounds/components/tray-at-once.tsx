import { useState } from 'react';
import { EVENT_WORDS, type EventKind } from '#shared/domain/event-kinds';
import type { RoundItemView } from '#shared/schemas/rounds';
import { Button } from '@/components/ui/button';

const CHOICES: (EventKind | 'none')[] = ['ate', 'refused', 'prey_left_in', 'skipped', 'none'];
const WORD = (c: EventKind | 'none') => (c === 'none' ? 'Not now' : EVENT_WORDS[c]);

/** Items on this shelf or tray still waiting to be fed: the ones a tray-at-once can settle. */
export const unfed = (items: readonly RoundItemView[]) => items.filter((i) => i.tasks.some((t) => t.kind === 'feed' && !t.done));

interface Props {
  label: string;
  items: readonly RoundItemView[];
  onRecord: (list: { animal: RoundItemView['animal']; kind: EventKind }[]) => Promise<unknown>;
}

/**
 * "All ate except …" for a tray of slings: one action, one event per animal, exceptions picked
 * from a list. Written in one transaction on the phone, so it works with no signal.
 */
export function TrayAtOnce({ label, items, onRecord }: Props) {
  const [open, setOpen] = useState(false);
  const [picks, setPicks] = useState<Record<string, EventKind | 'none'>>({});
  const [busy, setBusy] = useState(false);
  const list = unfed(items);
  if (list.length < 2) return null;
  const choice = (id: string) => picks[id] ?? 'ate';
  const chosen = list.filter((i) => choice(i.animal.id) !== 'none');
  const ate = chosen.filter((i) => choice(i.animal.id) === 'ate').length;
  return (
    <div className="rounded-2xl border-2 border-border bg-surface p-2">
      {!open ? (
        <Button variant="secondary" wide onClick={() => setOpen(true)}>
          Whole shelf at once ({list.length})
        </Button>
      ) : (
        <form
          aria-label={`Feed ${label} at once`}
          className="flex flex-col gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            setBusy(true);
            void onRecord(chosen.map((i) => ({ animal: i.animal, kind: choice(i.animal.id) as EventKind }))).finally(() => {
              setBusy(false);
              setOpen(false);
              setPicks({});
            });
          }}
        >
          <p className="font-bold">All ate, except the ones you change:</p>
          <ul className="flex flex-col gap-1">
            {list.map((i) => (
              <li key={i.animal.id} className="flex items-center gap-2">
                <label htmlFor={`tray-${i.animal.id}`} className="min-w-0 flex-1 truncate">
                  <span className="font-bold">{i.animal.name}</span> <span className="font-mono text-sm">{i.animal.labelCode}</span>
                </label>
                <select
                  id={`tray-${i.animal.id}`}
                  value={choice(i.animal.id)}
                  onChange={(e) => setPicks((p) => ({ ...p, [i.animal.id]: e.target.value as EventKind | 'none' }))}
                  className="min-h-target rounded-xl border-2 border-border bg-surface px-2 text-base text-text"
                >
                  {CHOICES.map((c) => (
                    <option key={c} value={c}>
                      {WORD(c)}
                    </option>
                  ))}
                </select>
              </li>
            ))}
          </ul>
          <Button type="submit" busy={busy} disabled={!chosen.length}>
            Record {chosen.length}: {ate} ate{chosen.length > ate ? `, ${chosen.length - ate} other` : ''}
          </Button>
          <Button variant="quiet" onClick={() => setOpen(false)}>
            Cancel
          </Button>
        </form>
      )}
    </div>
  );
}
