import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { STATUS_LABEL } from '#shared/domain/animal-facts';
import { RETIRED_STATUSES, retireBody, type RetireBody } from '#shared/schemas/animals';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
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
  const { register, handleSubmit, setError, formState } = useForm<
    z.input<typeof retireBody>,
    unknown,
    z.output<typeof retireBody>
  >({
    resolver: zodResolver(retireBody),
    defaultValues: { status: 'sold', date: today, note: '' },
  });
  const { problem, attempt } = useServerProblem(setError);
  const e = formState.errors;
  return (
    <form
      className="flex flex-col gap-3 rounded-2xl border-2 border-accent bg-surface p-3"
      onSubmit={handleSubmit((body) => attempt(() => onRetire(body)))}
    >
      <p className="font-bold">Retire {what}? It leaves the round; its history stays.</p>
      <SelectField
        label="Why"
        error={e.status?.message}
        options={RETIRED_STATUSES.map((s) => ({ value: s, label: STATUS_LABEL[s] }))}
        {...register('status')}
      />
      <TextField label="Date" type="date" error={e.date?.message} {...register('date')} />
      <TextField label="Note" error={e.note?.message} {...register('note')} />
      <PanelActions
        word="Retire"
        busy={formState.isSubmitting}
        error={problem}
        onCancel={onCancel}
      />
    </form>
  );
}
