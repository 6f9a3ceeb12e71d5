import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { incubationBody } from '#shared/schemas/breeding';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useBreedingChanges } from '../api/breeding-api';

/** The two numbers as typed, checked by the API's own schema. */
const incubationForm = z
  .object({ minDays: z.string(), maxDays: z.string() })
  .transform((v) => ({ minDays: Number(v.minDays), maxDays: Number(v.maxDays) }))
  .pipe(incubationBody);
type Input = z.input<typeof incubationForm>;
type Output = z.output<typeof incubationForm>;

/** The collection's usual waiting window for new egg sacs. */
export function IncubationForm({ collectionId }: { collectionId: string }) {
  const { incubation } = useBreedingChanges(collectionId);
  const { register, handleSubmit, setError, formState } = useForm<Input, unknown, Output>({
    resolver: zodResolver(incubationForm),
    defaultValues: { minDays: '42', maxDays: '56' },
  });
  const { problem, attempt } = useServerProblem(setError);
  const e = formState.errors;
  const submit = handleSubmit((body) => attempt(() => incubation.mutateAsync(body)));
  return (
    <form
      className="grid grid-cols-2 gap-2 rounded-2xl border-2 border-border p-3"
      onSubmit={submit}
    >
      <p className="col-span-2 font-extrabold">Usual incubation for new egg sacs</p>
      <p className="col-span-2 text-sm text-muted">
        Common practice is about 6–8 weeks from laying to pulling or hatching; it varies by species,
        so set what your species need. Egg cases (about 4–8 weeks) and broods (until they disperse)
        have their own windows, changed on each record.
      </p>
      <TextField
        label="Shortest (days)"
        inputMode="numeric"
        error={e.minDays?.message}
        {...register('minDays')}
      />
      <TextField
        label="Longest (days)"
        inputMode="numeric"
        error={e.maxDays?.message}
        {...register('maxDays')}
      />
      {problem && <Notice tone="error" title={problem} />}
      {incubation.isSuccess && <Notice tone="ok" title="Saved for new sacs." />}
      <Button
        type="submit"
        variant="secondary"
        className="col-span-2"
        busy={formState.isSubmitting}
      >
        Save
      </Button>
    </form>
  );
}
