import { useState } from 'react';
import type { LocationSummary } from '#shared/schemas/animals';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { useAction } from '@/lib/use-action';
import { PanelActions } from './panel-actions';

/**
 * Moves one animal or many to one place; each move is kept in the animal's history. "Into a new
 * enclosure" marks a rehouse, which starts a settling period (docs/care-rules.md § R16).
 */
export function MovePanel({ what, locations, current, onMove, onCancel }: { what: string; locations: readonly LocationSummary[]; current?: string | null; onMove: (locationId: string, rehoused: boolean) => Promise<unknown>; onCancel: () => void }) {
  const [to, setTo] = useState(current ?? locations[0]?.id ?? '');
  const [rehoused, setRehoused] = useState(false);
  const action = useAction();
  if (!locations.length) return <Notice tone="info" title="Add places first (Animals → Places)." />;
  return (
    <form
      className="flex flex-col gap-3 rounded-2xl border-2 border-border bg-surface p-3"
      onSubmit={(e) => {
        e.preventDefault();
        action.run(() => onMove(to, rehoused));
      }}
    >
      <SelectField label={`Move ${what} to`} value={to} onChange={(e) => setTo(e.target.value)} options={locations.map((l) => ({ value: l.id, label: `${l.room} · ${l.rack}${l.shelf}-${l.position}` }))} />
      <label className="flex min-h-target cursor-pointer items-center gap-3 font-bold">
        <input type="checkbox" className="size-6 accent-[var(--c-primary)]" checked={rehoused} onChange={(e) => setRehoused(e.target.checked)} />
        Into a new enclosure (no food for a few days while it settles)
      </label>
      <PanelActions word="Move" busy={action.busy} error={action.error} onCancel={onCancel} />
    </form>
  );
}
