import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { GROUP_LABEL, type AnimalGroup } from '#shared/domain/animal-facts';
import {
  breedingModeOf,
  isOpenRecord,
  type BreedingMode,
  type BreedingRecordKind,
} from '#shared/domain/breeding';
import { formatDateRange, formatLocalDate } from '#shared/domain/date-words';
import { eggSacBody, type EggSacView } from '#shared/schemas/breeding';
import type { LocationWithCount } from '#shared/schemas/locations';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { Loading } from '@/components/ui/spinner';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useBreedingChanges, useEggSacs } from '../api/breeding-api';
import { PotUpForm } from './pot-up-form';
import { SacUpdateForm } from './sac-update-form';

/** A female who can have a sac, case or brood (the route lists only those: `canBreed`). */
interface Female {
  id: string;
  name: string;
  labelCode: string;
  group: AnimalGroup;
}

interface Props {
  collectionId: string;
  today: string;
  females: readonly Female[];
  /** The collection's places in walk order, for the pot-up's shelf. */
  places: readonly LocationWithCount[];
  /** The new slings' ids, to print their labels. */
  onSlings: (animalIds: string[]) => void;
}

const A: Record<BreedingRecordKind, string> = {
  egg_sac: 'an egg sac',
  egg_case: 'an egg case',
  brood: 'a brood',
};
const THE: Record<BreedingRecordKind, string> = {
  egg_sac: 'the sac',
  egg_case: 'the egg case',
  brood: 'the brood',
};

/** What a female's record means for her on the round, in a sentence. */
function howSheIsTreated(mode: BreedingMode): string {
  if (mode.record === 'egg_case')
    return `A mantis does not guard her egg case: she stays on the round. Expect the hatch in about ${mode.window!.minDays / 7}–${mode.window!.maxDays / 7} weeks.`;
  if (mode.record === 'brood')
    return 'She is left alone while she guards her brood; her water dish is still topped up quietly. When it disperses, her rebuild (fed more often) starts by itself.';
  return 'She is left alone while she guards it; her water dish is still topped up quietly. When you pull it, or it hatches with her, her rebuild (fed more often) starts by itself.';
}

const day = (date: string) => formatLocalDate(date);

/** The dates and counts that mean something for this kind of record. */
function dateLine(sac: EggSacView, mode: BreedingMode) {
  const expected =
    sac.kind === 'brood'
      ? `likely to disperse ${formatDateRange(sac.expectedFrom, sac.expectedTo)}`
      : `expected ${formatDateRange(sac.expectedFrom, sac.expectedTo)}`;
  return [
    `${mode.words.startedOn} ${day(sac.laidOn)}`,
    expected,
    sac.pulledOn && `pulled ${day(sac.pulledOn)}`,
    sac.hatchedOn && `hatched ${day(sac.hatchedOn)}`,
    sac.dispersedOn && `dispersed ${day(sac.dispersedOn)}`,
  ]
    .filter(Boolean)
    .join(' · ');
}

function countLine(sac: EggSacView, mode: BreedingMode) {
  const young = mode.words.young;
  const parts =
    sac.kind === 'egg_sac'
      ? [
          `Eggs ${sac.eggCount ?? '—'}`,
          `with legs ${sac.eggsWithLegs ?? '—'}`,
          `slings ${sac.slingCount ?? '—'}`,
        ]
      : sac.kind === 'egg_case' || mode.words.count !== 'Eggs'
        ? [`${capitalise(young)} ${sac.slingCount ?? '—'}`]
        : [`Eggs ${sac.eggCount ?? '—'}`, `${young} ${sac.slingCount ?? '—'}`];
  return [...parts, `potted up ${sac.slingsCreated}`].join(' · ');
}
const capitalise = (w: string) => w.charAt(0).toUpperCase() + w.slice(1);

function SacCard({
  sac,
  today,
  collectionId,
  places,
  onSlings,
}: {
  sac: EggSacView;
  today: string;
  collectionId: string;
  places: Props['places'];
  onSlings: Props['onSlings'];
}) {
  const mode = breedingModeOf(sac.femaleGroup);
  const [open, setOpen] = useState<'update' | 'slings' | null>(null);
  const due = isOpenRecord(sac) && today >= sac.expectedFrom;
  const young = mode.words.young;
  return (
    <li className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3">
      <p className="font-extrabold">
        {sac.clutch} · {sac.femaleName}
        <span className="ml-2 inline-block rounded-md border-2 border-border px-1.5 text-sm font-bold">
          {mode.words.record}
        </span>
      </p>
      <p className="text-sm">{dateLine(sac, mode)}</p>
      {due && <p className="font-bold text-accent">Due: check {THE[sac.kind]}.</p>}
      <p className="text-sm text-muted">{countLine(sac, mode)}</p>
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" onClick={() => setOpen(open === 'update' ? null : 'update')}>
          Update…
        </Button>
        <Button variant="secondary" onClick={() => setOpen(open === 'slings' ? null : 'slings')}>
          Pot up {young}…
        </Button>
      </div>
      {open === 'update' && (
        <SacUpdateForm
          sac={sac}
          mode={mode}
          today={today}
          collectionId={collectionId}
          youngLabel={capitalise(young)}
          onSaved={() => setOpen(null)}
        />
      )}
      {open === 'slings' && (
        <PotUpForm
          sac={sac}
          collectionId={collectionId}
          young={young}
          places={places}
          onSlings={onSlings}
        />
      )}
    </li>
  );
}

/** Egg sacs, egg cases and broods from laying (or birth) to potting up, after each female's group. */
export function SacsManager({ collectionId, today, females, places, onSlings }: Props) {
  const sacs = useEggSacs(collectionId);
  return (
    <div className="flex flex-col gap-4">
      <NewRecordForm collectionId={collectionId} today={today} females={females} />
      {sacs.isPending && <Loading />}
      {sacs.isError && <Notice tone="error" title={sacs.error.message} />}
      <h2 className="text-xl font-extrabold">
        Breeding register
        {sacs.data && <span className="text-muted"> ({sacs.data.sacs.length})</span>}
      </h2>
      {sacs.data?.sacs.length === 0 && (
        <div
          role="note"
          aria-label="About the breeding register"
          className="flex flex-col gap-1 rounded-2xl border-2 border-dashed border-border p-3"
        >
          <p className="font-bold">Nothing in the register yet.</p>
          <p>
            When a female lays an egg sac or an egg case, or carries a brood, record it above with
            the day it began. Rackside then works out when to expect the hatch, leaves a guarding
            female alone on the round (her water still topped up), and pots the young up into
            numbered slings with their own labels.
          </p>
          <p className="text-sm text-muted">
            Only animals recorded as female can be chosen, of the groups that breed this way:
            tarantulas, true spiders, scorpions, centipedes and mantids.
          </p>
        </div>
      )}
      <ul aria-label="Egg sacs, egg cases and broods" className="flex flex-col gap-2">
        {sacs.data?.sacs.map((sac) => (
          <SacCard
            key={sac.id}
            sac={sac}
            today={today}
            collectionId={collectionId}
            places={places}
            onSlings={onSlings}
          />
        ))}
      </ul>
    </div>
  );
}

/** The new record's fields, the count checked by the rule of the field it is sent as. */
const newRecordForm = (countField: 'eggCount' | 'slingCount') =>
  eggSacBody.pick({ femaleId: true, laidOn: true, clutch: true }).extend({
    count: z
      .string()
      .transform((v): number | null | undefined => (v.trim() === '' ? undefined : Number(v)))
      .pipe(eggSacBody.shape[countField]),
  });
type NewRecordInput = z.input<ReturnType<typeof newRecordForm>>;
type NewRecordOutput = z.output<ReturnType<typeof newRecordForm>>;

/** The chosen female (the first while none is), her group's way of breeding and where its count goes. */
function recordFor(females: readonly Female[], femaleId: string) {
  const female = females.find((f) => f.id === femaleId) ?? females[0];
  const mode = breedingModeOf(female?.group ?? 'tarantula');
  const kind = mode.record ?? 'egg_sac';
  const countField =
    kind === 'brood' && mode.words.count === 'Scorplings'
      ? ('slingCount' as const)
      : ('eggCount' as const);
  return { female, mode, kind, countField };
}

/** A new sac, egg case or brood: its words and what is counted follow the chosen female's group. */
function NewRecordForm({ collectionId, today, females }: Omit<Props, 'onSlings' | 'places'>) {
  const { create } = useBreedingChanges(collectionId);
  const { register, handleSubmit, setError, setValue, watch, formState } = useForm<
    NewRecordInput,
    unknown,
    NewRecordOutput
  >({
    resolver: (values, context, options) =>
      zodResolver(newRecordForm(recordFor(females, values.femaleId).countField))(
        values,
        context,
        options,
      ),
    defaultValues: { femaleId: females[0]?.id ?? '', laidOn: today, clutch: '', count: '' },
  });
  const { female, mode, kind, countField } = recordFor(females, watch('femaleId'));
  const { problem, attempt } = useServerProblem(setError);
  const e = formState.errors;
  const submit = handleSubmit((v) =>
    attempt(async () => {
      if (!female) return;
      await create.mutateAsync({
        femaleId: female.id,
        laidOn: v.laidOn,
        clutch: v.clutch || undefined,
        ...(mode.words.count && v.count !== undefined ? { [countField]: v.count } : {}),
      });
      setValue('clutch', '');
      setValue('count', '');
    }),
  );
  return (
    <form
      aria-labelledby="new-sac-heading"
      className="flex flex-col gap-2 rounded-2xl border-2 border-border p-3"
      onSubmit={submit}
    >
      <h2 id="new-sac-heading" className="text-xl font-extrabold">
        Record {A[kind]}
      </h2>
      {females.length ? (
        <SelectField
          label="Female"
          error={e.femaleId?.message}
          options={females.map((f) => ({
            value: f.id,
            label: `${f.name} (${f.labelCode})${f.group === 'tarantula' ? '' : ` · ${GROUP_LABEL[f.group]}`}`,
          }))}
          {...register('femaleId')}
        />
      ) : (
        <Notice
          tone="info"
          title="No female to choose yet. Sacs, egg cases and broods are recorded for animals recorded as female: tarantulas, true spiders, mantids, scorpions and centipedes."
        />
      )}
      <TextField
        label={mode.words.startedOn}
        type="date"
        max={today}
        error={e.laidOn?.message}
        {...register('laidOn')}
      />
      {mode.words.count && kind === 'brood' && (
        <TextField
          label={mode.words.count}
          inputMode="numeric"
          error={e.count?.message}
          {...register('count')}
        />
      )}
      <TextField
        label="Clutch name"
        hint={`Its ${mode.words.young} share it. Empty: the female's name and the date.`}
        error={e.clutch?.message}
        {...register('clutch')}
      />
      <p className="text-sm text-muted">{howSheIsTreated(mode)}</p>
      {problem && <Notice tone="error" title={problem} />}
      <Button type="submit" disabled={!female} busy={formState.isSubmitting}>
        Record {THE[kind]}
      </Button>
    </form>
  );
}
