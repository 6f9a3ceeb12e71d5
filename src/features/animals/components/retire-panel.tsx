import { useState } from 'react';
import { STATUS_LABEL } from '#shared/domain/animal-facts';
import { RETIRED_STATUSES, type RetireBody } from '#shared/schemas/animals';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useAction } from '@/lib/use-action';
import { PanelActions } from './panel-actions';

interface Props {
  /** "this animal" or "12 animals", for the wording. */
  what: string;
  today: string;
  onRetire: (body: RetireBody) => Promise<unknown>;
  onCancel: () => void;
}

/** Sold, deceased, rehomed or on loan: off the round from now on, history kept. */
export function RetirePanel({ what, today, onRetire, onCancel }: Props) {
  const [status, setStatus] = useState<RetireBody['status']>('sold');
  const [date, setDate] = useState(today);
  const [note, setNote] = useState('');
  const action = useAction();
  return (
    <form
      className="flex flex-col gap-3 rounded-2xl border-2 border-accent bg-surface p-3"
      onSubmit={(e) => {
        e.preventDefault();
        action.run(() => onRetire({ status, date, note: note || null }));
      }}
    >
      <p className="font-bold">Retire {what}? It leaves the round; its history stays.</p>
      <SelectField label="Why" value={status} onChange={(e) => setStatus(e.target.value as RetireBody['status'])} options={RETIRED_STATUSES.map((s) => ({ value: s, label: STATUS_LABEL[s] }))} />
      <TextField label="Date" type="date" value={date} onChange={(e) => setDate(e.target.value)} />
      <TextField label="Note" value={note} onChange={(e) => setNote(e.target.value)} />
      <PanelActions word="Retire" busy={action.busy} error={action.error} onCancel={onCancel} />
    </form>
  );
}
