import { useState } from 'react';
import { DIET_LABEL, DIETS } from '#shared/domain/animal-facts';
import { GROUP_CARE } from '#shared/domain/rounds/care-profiles';
import type { AnimalSummary } from '#shared/schemas/animals';
import { careSettingsBody, type CareSettingsBody } from '#shared/schemas/rules';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useSaveCare } from '../api/schedule';

const numberOrNull = (v: string) => (v.trim() === '' ? null : Number(v));
const textOrNull = (v: string) => (v.trim() === '' ? null : v.trim());

/** The animal's own settings that the round engine honours before the collection's rules. */
export function CareForm({ collectionId, animal }: { collectionId: string; animal: AnimalSummary }) {
  const save = useSaveCare(collectionId, animal.id);
  const [values, setValues] = useState({
    intervalDays: animal.intervalDays?.toString() ?? '',
    preyType: animal.preyType?.toString() ?? '',
    preySize: animal.preySize?.toString() ?? '',
    preyCount: animal.preyCount?.toString() ?? '',
    diet: animal.diet ?? '',
    doNotFeedUntil: animal.doNotFeedUntil?.toString() ?? '',
    hasWaterDish: animal.hasWaterDish,
  });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const byDiet = Object.values(GROUP_CARE[animal.group].food).includes('diet');
  const set = (key: keyof typeof values) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) =>
    setValues((v) => ({ ...v, [key]: e.target.type === 'checkbox' ? e.target.checked : e.target.value }));

  function submit(e: React.FormEvent) {
    e.preventDefault();
    const body = {
      intervalDays: numberOrNull(values.intervalDays),
      preyType: textOrNull(values.preyType),
      preySize: textOrNull(values.preySize),
      preyCount: numberOrNull(values.preyCount),
      diet: textOrNull(values.diet),
      doNotFeedUntil: textOrNull(values.doNotFeedUntil),
      hasWaterDish: values.hasWaterDish,
    };
    const parsed = careSettingsBody.safeParse(body);
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
      return;
    }
    setErrors({});
    save.mutate(parsed.data as CareSettingsBody);
  }

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3 rounded-2xl border-2 border-border bg-surface p-3">
      <h2 className="text-xl font-extrabold">Care settings</h2>
      <p className="text-sm text-muted">Leave a field empty to use the collection’s rules.</p>
      {save.isError && <Notice tone="error" title={save.error.message} />}
      {save.isSuccess && <Notice tone="ok" title="Saved. The schedule above is updated." />}
      <TextField label="Feed every (days)" inputMode="numeric" value={values.intervalDays} onChange={set('intervalDays')} error={errors.intervalDays} />
      <TextField label="Prey" placeholder="e.g. roach" value={values.preyType} onChange={set('preyType')} error={errors.preyType} />
      <TextField label="Prey size" placeholder="e.g. medium" value={values.preySize} onChange={set('preySize')} error={errors.preySize} />
      <TextField label="How many" inputMode="numeric" value={values.preyCount} onChange={set('preyCount')} error={errors.preyCount} />
      {byDiet && (
        <SelectField
          label="Diet"
          value={values.diet}
          onChange={set('diet')}
          options={[{ value: '', label: `Usual: ${DIET_LABEL[GROUP_CARE[animal.group].defaultDiet].toLowerCase()}` }, ...DIETS.map((d) => ({ value: d, label: DIET_LABEL[d] }))]}
        />
      )}
      <TextField label="Do not feed until" type="date" value={values.doNotFeedUntil} onChange={set('doNotFeedUntil')} error={errors.doNotFeedUntil} />
      <label className="flex min-h-target items-center gap-3 font-bold">
        <input type="checkbox" className="h-6 w-6 accent-[var(--c-primary)]" checked={values.hasWaterDish} onChange={set('hasWaterDish')} />
        Has a water dish
      </label>
      <Button type="submit" variant="secondary" busy={save.isPending}>
        Save care settings
      </Button>
    </form>
  );
}
