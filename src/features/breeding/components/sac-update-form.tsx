import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import type { BreedingMode } from '#shared/domain/breeding';
import { eggSacChange, type EggSacChange, type EggSacView } from '#shared/schemas/breeding';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useBreedingChanges } from '../api/breeding-api';

/** The record's dates and counts as typed, named by the change's paths so each message finds its box. */
interface ChangeText {
  laidOn: string;
  pulledOn: string;
  hatchedOn: string;
  dispersedOn: string;
  eggCount: string;
  eggsWithLegs: string;
  slingCount: string;
  incubation: { minDays: string; maxDays: string };
}

const dateOrNull = (v: string) => v || null;
const countOrNull = (v: string) => (v.trim() === '' ? null : Number(v));

/** Only the dates and counts that mean something for this kind of record are sent. */
function kindChange(u: ChangeText, sac: EggSacView, mode: BreedingMode): EggSacChange {
  if (sac.kind === 'egg_sac')
    return {
      pulledOn: dateOrNull(u.pulledOn),
      hatchedOn: dateOrNull(u.hatchedOn),
      eggCount: countOrNull(u.eggCount),
      eggsWithLegs: countOrNull(u.eggsWithLegs),
      slingCount: countOrNull(u.slingCount),
    };
  if (sac.kind === 'egg_case')
    return { hatchedOn: dateOrNull(u.hatchedOn), slingCount: countOrNull(u.slingCount) };
  return {
    dispersedOn: dateOrNull(u.dispersedOn),
    slingCount: countOrNull(u.slingCount),
    ...(mode.words.count === 'Eggs'
      ? { hatchedOn: dateOrNull(u.hatchedOn), eggCount: countOrNull(u.eggCount) }
      : {}),
  };
}

/** The typed text turned into the change the API takes, checked by the API's own schema. */
const changeForm = (sac: EggSacView, mode: BreedingMode) =>
  z
    .custom<ChangeText>()
    .transform((u): EggSacChange => ({
      laidOn: u.laidOn,
      ...kindChange(u, sac, mode),
      incubation: { minDays: Number(u.incubation.minDays), maxDays: Number(u.incubation.maxDays) },
    }))
    .pipe(eggSacChange);

const text = (n: number | null) => n?.toString() ?? '';

interface Props {
  sac: EggSacView;
  mode: BreedingMode;
  today: string;
  collectionId: string;
  /** "Slings", "Nymphs": what the young count is called. */
  youngLabel: string;
  onSaved: () => void;
}

/** A sac's, egg case's or brood's dates, counts and waiting window, after it was recorded. */
export function SacUpdateForm({ sac, mode, today, collectionId, youngLabel, onSaved }: Props) {
  const { change } = useBreedingChanges(collectionId);
  const { register, handleSubmit, setError, formState } = useForm<
    ChangeText,
    unknown,
    z.output<typeof eggSacChange>
  >({
    resolver: zodResolver(changeForm(sac, mode)),
    defaultValues: {
      laidOn: sac.laidOn,
      pulledOn: sac.pulledOn ?? '',
      hatchedOn: sac.hatchedOn ?? '',
      dispersedOn: sac.dispersedOn ?? '',
      eggCount: text(sac.eggCount),
      eggsWithLegs: text(sac.eggsWithLegs),
      slingCount: text(sac.slingCount),
      incubation: {
        minDays: String(sac.incubationMinDays),
        maxDays: String(sac.incubationMaxDays),
      },
    },
  });
  const { problem, attempt } = useServerProblem(setError);
  const e = formState.errors;
  const submit = handleSubmit((body) =>
    attempt(async () => {
      await change.mutateAsync({ sacId: sac.id, body });
      onSaved();
    }),
  );
  return (
    <form aria-label={`Update ${sac.clutch}`} className="grid grid-cols-2 gap-2" onSubmit={submit}>
      <TextField
        label={mode.words.startedOn}
        type="date"
        max={today}
        error={e.laidOn?.message}
        {...register('laidOn')}
      />
      {sac.kind === 'egg_sac' && (
        <TextField
          label="Pulled on"
          type="date"
          max={today}
          error={e.pulledOn?.message}
          {...register('pulledOn')}
        />
      )}
      {(sac.kind !== 'brood' || mode.words.count === 'Eggs') && (
        <TextField
          label="Hatched on"
          type="date"
          max={today}
          error={e.hatchedOn?.message}
          {...register('hatchedOn')}
        />
      )}
      {sac.kind === 'brood' && (
        <TextField
          label="Dispersed on"
          type="date"
          max={today}
          error={e.dispersedOn?.message}
          {...register('dispersedOn')}
        />
      )}
      {(sac.kind === 'egg_sac' || mode.words.count === 'Eggs') && (
        <TextField
          label="Eggs"
          inputMode="numeric"
          error={e.eggCount?.message}
          {...register('eggCount')}
        />
      )}
      {sac.kind === 'egg_sac' && (
        <TextField
          label="Eggs with legs"
          inputMode="numeric"
          error={e.eggsWithLegs?.message}
          {...register('eggsWithLegs')}
        />
      )}
      <TextField
        label={youngLabel}
        inputMode="numeric"
        error={e.slingCount?.message}
        {...register('slingCount')}
      />
      <TextField
        label={sac.kind === 'brood' ? 'Dispersal from (days)' : 'Incubation from (days)'}
        inputMode="numeric"
        error={e.incubation?.minDays?.message}
        {...register('incubation.minDays')}
      />
      <TextField
        label="to (days)"
        inputMode="numeric"
        error={e.incubation?.maxDays?.message}
        {...register('incubation.maxDays')}
      />
      {problem && (
        <div className="col-span-2">
          <Notice tone="error" title={problem} />
        </div>
      )}
      <Button type="submit" className="col-span-2" busy={formState.isSubmitting}>
        Save
      </Button>
    </form>
  );
}
