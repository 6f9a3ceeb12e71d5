import { useState } from 'react';
import type { LocationSummary } from '#shared/schemas/animals';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { useAction } from '@/lib/use-action';
import { PanelActions } from './panel-actions';

/** Moves one animal or many to one place; each move is kept in the animal's history. */
export function MovePanel({ what, locations, onMove, onCancel }: { what: string; locations: readonly LocationSummary[]; onMove: (locationId: string) => Promise<unknown>; onCancel: () => void }) {
  const [to, setTo] = useState(locations[0]?.id ?? '');
  const action = useAction();
  if (!locations.length) return <Notice tone="info" title="Add places first (Animals → Places)." />;
  return (
    <form
      className="flex flex-col gap-3 rounded-2xl border-2 border-border bg-surface p-3"
      onSubmit={(e) => {
        e.preventDefault();
        action.run(() => onMove(to));
      }}
    >
      <SelectField label={`Move ${what} to`} value={to} onChange={(e) => setTo(e.target.value)} options={locations.map((l) => ({ value: l.id, label: `${l.room} · ${l.rack}${l.shelf}-${l.position}` }))} />
      <PanelActions word="Move" busy={action.busy} error={action.error} onCancel={onCancel} />
    </form>
  );
}
