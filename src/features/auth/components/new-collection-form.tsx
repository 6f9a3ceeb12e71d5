import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { newCollectionBody } from '#shared/schemas/collections';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useCreateCollection } from '../api/create-collection';
import { deviceZone } from './account-fields';

type Input = z.input<typeof newCollectionBody>;
type Output = z.output<typeof newCollectionBody>;

/** A new, empty collection of one's own; this device switches to it once it exists. */
export function NewCollectionForm({ onCreated }: { onCreated: () => void }) {
  const create = useCreateCollection();
  const { register, handleSubmit, setError, formState } = useForm<Input, unknown, Output>({
    resolver: zodResolver(newCollectionBody),
    defaultValues: { name: '', timeZone: deviceZone },
  });
  const { problem, attempt } = useServerProblem(setError);
  const e = formState.errors;
  const submit = handleSubmit((values) =>
    attempt(async () => {
      await create.mutateAsync(values);
      onCreated();
    }),
  );
  return (
    <form className="flex flex-col gap-3" onSubmit={submit} noValidate>
      <TextField label="Collection name" error={e.name?.message} {...register('name')} />
      <TextField
        label="Time zone"
        hint="Its rounds follow the calendar days of this zone."
        autoComplete="off"
        error={e.timeZone?.message}
        {...register('timeZone')}
      />
      {problem && <Notice tone="error" title={problem} />}
      <Button type="submit" wide busy={formState.isSubmitting}>
        Start the collection
      </Button>
    </form>
  );
}
