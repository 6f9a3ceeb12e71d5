import { lazy, Suspense, useState } from 'react';
import type { EventKind } from '#shared/domain/event-kinds';
import type { RoundItemView } from '#shared/schemas/rounds';
import { Button } from '@/components/ui/button';
import { Loading } from '@/components/ui/spinner';
import type { Choice } from './tray-form';

// The form loads when first opened, from the service worker's cache when offline, so the
// round's first bundle stays small (P4).
const TrayForm = lazy(() => import('./tray-form').then((m) => ({ default: m.TrayForm })));

/** Items on this shelf or tray still waiting to be fed: the ones a tray-at-once can settle. */
export const unfed = (items: readonly RoundItemView[]) =>
  items.filter((i) => i.tasks.some((t) => t.kind === 'feed' && !t.done));

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
  const [picks, setPicks] = useState<Record<string, Choice>>({});
  const list = unfed(items);
  if (list.length < 2) return null;
  return (
    <div className="rounded-2xl border-2 border-border bg-surface p-2">
      {!open ? (
        <Button variant="secondary" wide onClick={() => setOpen(true)}>
          Whole shelf at once ({list.length})
        </Button>
      ) : (
        <Suspense fallback={<Loading />}>
          <TrayForm
            label={label}
            list={list}
            picks={picks}
            onPick={(id, choice) => setPicks((p) => ({ ...p, [id]: choice }))}
            onRecord={(chosen) => onRecord(chosen).finally(() => setPicks({}))}
            onClose={() => setOpen(false)}
          />
        </Suspense>
      )}
    </div>
  );
}
