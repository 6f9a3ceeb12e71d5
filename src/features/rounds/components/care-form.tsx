import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { DIET_LABEL, DIETS } from '#shared/domain/animal-facts';
import { GROUP_CARE } from '#shared/domain/rounds/care-profiles';
import type { AnimalSummary } from '#shared/schemas/animals';
import { careSettingsBody } from '#shared/schemas/rules';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useSaveCare } from '../api/schedule';

// An empty box clears the setting (null): the collection's rules decide again.
const numberOrNull = z
  .string()
  .transform((v): number | null | undefined => (v.trim() === '' ? null : Number(v)));
const textOrNull = z
  .string()
  .transform((v): string | null | undefined => (v.trim() === '' ? null : v.trim()));

/** The settings as typed, each checked by the API's own rule for it. */
const care = careSettingsBody.shape;
const careForm = z.object({
  intervalDays: numberOrNull.pipe(care.intervalDays),
  preyType: textOrNull.pipe(care.preyType),
  preySize: textOrNull.pipe(care.preySize),
  preyCount: numberOrNull.pipe(care.preyCount),
  diet: textOrNull.pipe(care.diet),
  doNotFeedUntil: textOrNull.pipe(care.doNotFeedUntil),
  hasWaterDish: care.hasWaterDish.unwrap(),
});
type Input = z.input<typeof careForm>;
type Output = z.output<typeof careForm>;

/** The animal's own settings that the round engine honours before the collection's rules. */
export function CareForm({
  collectionId,
  animal,
}: {
  collectionId: string;
  animal: AnimalSummary;
}) {
  const save = useSaveCare(collectionId, animal.id);
  const { register, handleSubmit, setError, formState } = useForm<Input, unknown, Output>({
    resolver: zodResolver(careForm),
    defaultValues: {
      intervalDays: animal.intervalDays?.toString() ?? '',
      preyType: animal.preyType ?? '',
      preySize: animal.preySize ?? '',
      preyCount: animal.preyCount?.toString() ?? '',
      diet: animal.diet ?? '',
      doNotFeedUntil: animal.doNotFeedUntil ?? '',
      hasWaterDish: animal.hasWaterDish,
    },
  });
  const { problem, attempt } = useServerProblem(setError);
  const e = formState.errors;
  const byDiet = Object.values(GROUP_CARE[animal.group].food).includes('diet');
  const submit = handleSubmit((body) => attempt(() => save.mutateAsync(body)));

  return (
    <form
      onSubmit={submit}
      noValidate
      className="flex flex-col gap-3 rounded-2xl border-2 border-border bg-surface p-3"
    >
      <h2 className="text-xl font-extrabold">Care settings</h2>
      <p className="text-sm text-muted">Leave a field empty to use the collection’s rules.</p>
      {problem && <Notice tone="error" title={problem} />}
      {save.isSuccess && <Notice tone="ok" title="Saved. The schedule above is updated." />}
      <TextField
        label="Feed every (days)"
        inputMode="numeric"
        error={e.intervalDays?.message}
        {...register('intervalDays')}
      />
      <TextField
        label="Prey"
        placeholder="e.g. roach"
        error={e.preyType?.message}
        {...register('preyType')}
      />
      <TextField
        label="Prey size"
        placeholder="e.g. medium"
        error={e.preySize?.message}
        {...register('preySize')}
      />
      <TextField
        label="How many"
        inputMode="numeric"
        error={e.preyCount?.message}
        {...register('preyCount')}
      />
      {byDiet && (
        <SelectField
          label="Diet"
          error={e.diet?.message}
          options={[
            {
              value: '',
              label: `Usual: ${DIET_LABEL[GROUP_CARE[animal.group].defaultDiet].toLowerCase()}`,
            },
            ...DIETS.map((d) => ({ value: d, label: DIET_LABEL[d] })),
          ]}
          {...register('diet')}
        />
      )}
      <TextField
        label="Do not feed until"
        type="date"
        error={e.doNotFeedUntil?.message}
        {...register('doNotFeedUntil')}
      />
      <label className="flex min-h-target items-center gap-3 font-bold">
        <input
          type="checkbox"
          className="h-6 w-6 accent-[var(--c-primary)]"
          {...register('hasWaterDish')}
        />
        Has a water dish
      </label>
      <Button type="submit" variant="secondary" busy={formState.isSubmitting}>
        Save care settings
      </Button>
    </form>
  );
}
