import { lazy, memo, Suspense, useState } from 'react';
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
  /** Keep it stable (useCallback): a tap elsewhere then leaves this shelf's button alone. */
  onRecord: (
    label: string,
    list: { animal: RoundItemView['animal']; kind: EventKind }[],
  ) => Promise<unknown>;
}

/** The same items, one by one: a tap on another shelf leaves this one's list as it was. */
const sameProps = (a: Props, b: Props) =>
  a.label === b.label &&
  a.onRecord === b.onRecord &&
  a.items.length === b.items.length &&
  a.items.every((item, i) => item === b.items[i]);

/**
 * "All ate except …" for a tray of slings: one action, one event per animal, exceptions picked
 * from a list. Written in one transaction on the phone, so it works with no signal.
 */
export const TrayAtOnce = memo(function TrayAtOnce({ label, items, onRecord }: Props) {
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
            onRecord={(chosen) => onRecord(label, chosen).finally(() => setPicks({}))}
            onClose={() => setOpen(false)}
          />
        </Suspense>
      )}
    </div>
  );
}, sameProps);
