import { zodResolver } from '@hookform/resolvers/zod';
import { useId, useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import {
  ANIMAL_GROUPS,
  CAUTION_LABEL,
  CAUTIONS,
  DIET_LABEL,
  DIETS,
  GROUP_LABEL,
  SEX_LABEL,
  SEXES,
  STAGE_LABEL,
  stageLabel,
  stagesOf,
  type AnimalGroup,
  type Caution,
  type LifeStage,
} from '#shared/domain/animal-facts';
import { presetFor } from '#shared/domain/genus-presets';
import { GROUP_CARE } from '#shared/domain/rounds/care-profiles';
import { checkScientificName } from '#shared/domain/scientific-name';
import { sizeInUnit, sizeToMm, type SizeUnit } from '#shared/domain/units';
import {
  animalFields,
  checkStageFitsGroup,
  type AnimalSummary,
  type AnimalValues,
} from '#shared/schemas/animals';
import type { LocationWithCount } from '#shared/schemas/locations';
import { enclosureCareSettings } from '#shared/schemas/rules';
import {
  choiceOf,
  choiceProblems,
  existingPlace,
  occupantsAt,
  PlacePicker,
  TakenSpot,
  type PlaceChoice,
} from '@/components/place-picker';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';

const orNull = (v: string) => (v.trim() === '' ? null : v.trim());
const numberOrNull = (v: string) => (v.trim() === '' ? null : Number(v.replace(',', '.')));

const fields = animalFields.shape;
const care = fields.care.shape;

/**
 * The form as typed (text in every box, the size in the keeper's unit, care settings beside the
 * rest), each box checked by the animal's own rule in `animalFields` and turned into the API's
 * shape; `original` is the animal being edited, whose size it shows as `shownSize`.
 */
function animalForm(unit: SizeUnit, original: AnimalSummary | null, shownSize: string) {
  return animalFields
    .omit({ sizeMm: true, acquiredOn: true, locationId: true, care: true })
    .extend({
      size: z
        .string()
        .transform((v) => {
          // An unchanged size keeps its stored millimetres exactly, whatever unit is shown.
          if (original && v === shownSize) return original.sizeMm;
          const size = numberOrNull(v);
          return size === null || Number.isNaN(size) ? size : sizeToMm(size, unit);
        })
        .pipe(fields.sizeMm),
      acquiredOn: z.string().transform(orNull).pipe(fields.acquiredOn),
      locationId: z.string().transform(orNull).pipe(fields.locationId),
      intervalDays: z.string().transform(numberOrNull).pipe(care.intervalDays),
      preyType: z.string().transform(orNull).pipe(care.preyType),
      preySize: z.string().transform(orNull).pipe(care.preySize),
      preyCount: z.string().transform(numberOrNull).pipe(care.preyCount),
      diet: z
        .string()
        .transform((v): string | null | undefined => orNull(v))
        .pipe(care.diet),
      hasWaterDish: care.hasWaterDish,
      doNotFeedUntil: z.string().transform(orNull).pipe(care.doNotFeedUntil),
      mistEveryDays: z.string().transform(numberOrNull).pipe(enclosureCareSettings.mistEveryDays),
      moistenEveryDays: z
        .string()
        .transform(numberOrNull)
        .pipe(enclosureCareSettings.moistenEveryDays),
      spotCleanEveryDays: z
        .string()
        .transform(numberOrNull)
        .pipe(enclosureCareSettings.spotCleanEveryDays),
      enclosureLengthMm: enclosureSide(unit).pipe(enclosureCareSettings.enclosureLengthMm),
      enclosureWidthMm: enclosureSide(unit).pipe(enclosureCareSettings.enclosureWidthMm),
      enclosureHeightMm: enclosureSide(unit).pipe(enclosureCareSettings.enclosureHeightMm),
    })
    .superRefine(checkStageFitsGroup)
    .transform(
      ({
        size,
        intervalDays,
        preyType,
        preySize,
        preyCount,
        diet,
        hasWaterDish,
        doNotFeedUntil,
        mistEveryDays,
        moistenEveryDays,
        spotCleanEveryDays,
        enclosureLengthMm,
        enclosureWidthMm,
        enclosureHeightMm,
        ...rest
      }): AnimalValues => ({
        ...rest,
        sizeMm: size,
        care: {
          intervalDays,
          preyType,
          preySize,
          preyCount,
          diet,
          hasWaterDish,
          doNotFeedUntil,
          mistEveryDays,
          moistenEveryDays,
          spotCleanEveryDays,
          enclosureLengthMm,
          enclosureWidthMm,
          enclosureHeightMm,
        },
      }),
    );
}

/** An enclosure side typed in the keeper's unit, stored in whole mm (R22). */
const enclosureSide = (unit: SizeUnit) =>
  z.string().transform((v) => {
    const n = numberOrNull(v);
    return n === null || Number.isNaN(n) ? n : Math.round(sizeToMm(n, unit));
  });
const sideShown = (mm: number | null | undefined, unit: SizeUnit) =>
  mm == null ? '' : String(sizeInUnit(mm, unit));
type FormValues = z.input<ReturnType<typeof animalForm>>;

function fromAnimal(a: AnimalSummary | null, unit: SizeUnit): FormValues {
  return {
    labelCode: a?.labelCode ?? '',
    name: a?.name ?? '',
    scientificName: a?.scientificName ?? '',
    commonName: a?.commonName ?? '',
    group: a?.group ?? 'tarantula',
    lifeStage: a?.lifeStage ?? 'sling',
    sex: a?.sex ?? 'unknown',
    size: a?.sizeMm == null ? '' : String(sizeInUnit(a.sizeMm, unit)),
    acquiredOn: a?.acquiredOn ?? '',
    source: a?.source ?? '',
    locationId: a?.location?.id ?? '',
    cautions: a?.cautions ?? [],
    cautionNote: a?.cautionNote ?? '',
    notes: a?.notes ?? '',
    clutch: a?.clutch ?? '',
    intervalDays: a?.intervalDays?.toString() ?? '',
    preyType: a?.preyType ?? '',
    preySize: a?.preySize ?? '',
    preyCount: a?.preyCount?.toString() ?? '',
    diet: a?.diet ?? '',
    hasWaterDish: a?.hasWaterDish ?? false,
    doNotFeedUntil: a?.doNotFeedUntil ?? '',
    mistEveryDays: a?.mistEveryDays?.toString() ?? '',
    moistenEveryDays: a?.moistenEveryDays?.toString() ?? '',
    spotCleanEveryDays: a?.spotCleanEveryDays?.toString() ?? '',
    enclosureLengthMm: sideShown(a?.enclosureLengthMm, unit),
    enclosureWidthMm: sideShown(a?.enclosureWidthMm, unit),
    enclosureHeightMm: sideShown(a?.enclosureHeightMm, unit),
  };
}

/** The stage to switch to when the chosen one does not fit a new group: its first stage that eats. */
const firstFedStage = (group: AnimalGroup) =>
  stagesOf(group).find((s) => GROUP_CARE[group].food[s] !== 'none') ?? stagesOf(group)[0]!;
const hasDiet = (group: AnimalGroup) => Object.values(GROUP_CARE[group].food).includes('diet');

interface Props {
  animal: AnimalSummary | null;
  locations: readonly LocationWithCount[];
  /** A place named in the picker that does not exist yet: created on save, its id returned. */
  onCreatePlace: (place: PlaceChoice) => Promise<string>;
  /** Names already used in the collection, offered as the keeper types. */
  knownNames: readonly string[];
  unit: SizeUnit;
  onSave: (values: AnimalValues) => Promise<unknown>;
  onCancel: () => void;
}

export function AnimalForm({
  animal,
  locations,
  onCreatePlace,
  knownNames,
  unit,
  onSave,
  onCancel,
}: Props) {
  const listId = useId();
  const defaults = fromAnimal(animal, unit);
  const { register, handleSubmit, setError, setValue, watch, formState } = useForm<
    FormValues,
    unknown,
    AnimalValues
  >({
    resolver: zodResolver(animalForm(unit, animal, defaults.size)),
    defaultValues: defaults,
  });
  const { problem, attempt } = useServerProblem(setError);
  const e = formState.errors;
  const scientific = watch('scientificName');
  const check = useMemo(
    () => (scientific.trim() ? checkScientificName(scientific) : null),
    [scientific],
  );
  const group = watch('group') as AnimalGroup;
  const cautions = watch('cautions') as Caution[];
  // docs/care-rules.md § Genus presets: offered when the genus is known and differs, never forced.
  const preset = useMemo(() => presetFor(scientific), [scientific]);
  const presetDiffers =
    !!preset && (preset.group !== group || preset.cautions.some((c) => !cautions.includes(c)));
  function changeGroup(next: AnimalGroup, previous: AnimalGroup) {
    if (!stagesOf(next).includes(watch('lifeStage') as LifeStage))
      setValue('lifeStage', firstFedStage(next));
    // A new animal starts with its group's usual cautions and water (§ Care profiles).
    if (!animal) {
      const dropped = new Set<string>(GROUP_CARE[previous].newAnimalCautions);
      setValue('cautions', [
        ...new Set([
          ...cautions.filter((c) => !dropped.has(c)),
          ...GROUP_CARE[next].newAnimalCautions,
        ]),
      ]);
      setValue('hasWaterDish', GROUP_CARE[next].newAnimalHasDish);
    }
  }
  // A stage saved before stages were checked against the group stays visible, so its error makes sense.
  const stage = watch('lifeStage') as LifeStage;
  const stageOptions = [
    ...stagesOf(group).map((s) => ({ value: s, label: stageLabel(group, s) })),
    ...(stagesOf(group).includes(stage)
      ? []
      : [
          {
            value: stage,
            label: `${STAGE_LABEL[stage]} (not a ${GROUP_LABEL[group].toLowerCase()} stage)`,
          },
        ]),
  ];
  // The place is picked from the tree (or named anew) beside the form's own fields.
  const [place, setPlace] = useState<PlaceChoice>(choiceOf(animal?.location));
  const [share, setShare] = useState(false);
  const [placeTried, setPlaceTried] = useState(false);
  const mine = animal ? [animal.id] : [];
  const taken = occupantsAt(locations, place, mine);
  const placeMissing = place.room ? choiceProblems(place) : {};
  const placeBlocked = Object.keys(placeMissing).length > 0 || (taken.length > 0 && !share);
  async function locationIdOf(): Promise<string | null> {
    if (!place.room) return null;
    return existingPlace(locations, place)?.id ?? onCreatePlace(place);
  }

  return (
    <form
      onSubmit={(ev) => {
        setPlaceTried(true);
        return handleSubmit((values) =>
          placeBlocked
            ? undefined
            : attempt(async () => onSave({ ...values, locationId: await locationIdOf() })),
        )(ev);
      }}
      noValidate
      className="flex flex-col gap-4"
    >
      {problem && <Notice tone="error" title={problem} />}
      <fieldset className="flex flex-col gap-3">
        <legend className="mb-1 text-xl font-extrabold">What it is</legend>
        {!animal && (
          <TextField
            label="Label code"
            hint="Leave empty to get a new code, or type the code on an existing label."
            autoCapitalize="characters"
            error={e.labelCode?.message}
            {...register('labelCode')}
          />
        )}
        <TextField label="Name" error={e.name?.message} {...register('name')} />
        <TextField
          label="Scientific name"
          hint="Genus and species, e.g. Tliltocatl albopilosus; author and year if you like."
          list={listId}
          autoComplete="off"
          spellCheck={false}
          error={e.scientificName?.message}
          {...register('scientificName')}
        />
        <datalist id={listId}>
          {knownNames.map((n) => (
            <option key={n} value={n} />
          ))}
        </datalist>
        {check && !check.ok && check.suggestion && (
          <Button
            variant="secondary"
            onClick={() => setValue('scientificName', check.suggestion!, { shouldValidate: true })}
          >
            Use “{check.suggestion}”
          </Button>
        )}
        {preset && presetDiffers && (
          <Notice tone="info" title={`${preset.genus}: ${preset.note}.`}>
            <p className="text-sm">
              Usually {GROUP_LABEL[preset.group].toLowerCase()}
              {preset.cautions.length
                ? `, with ${preset.cautions.map((c) => CAUTION_LABEL[c].toLowerCase()).join(', ')}`
                : ''}
              . Source: {preset.source}.
            </p>
            <Button
              variant="secondary"
              className="mt-2"
              onClick={() => {
                if (preset.group !== group) {
                  changeGroup(preset.group, group);
                  setValue('group', preset.group);
                }
                setValue('cautions', [
                  ...new Set([...(watch('cautions') as Caution[]), ...preset.cautions]),
                ]);
              }}
            >
              Use these
            </Button>
          </Notice>
        )}
        <TextField label="Common name" error={e.commonName?.message} {...register('commonName')} />
        <div className="grid grid-cols-2 gap-2">
          <SelectField
            label="Group"
            options={ANIMAL_GROUPS.map((g) => ({ value: g, label: GROUP_LABEL[g] }))}
            {...register('group', {
              onChange: (e: React.ChangeEvent<HTMLSelectElement>) =>
                changeGroup(e.target.value as AnimalGroup, group),
            })}
          />
          <SelectField
            label="Life stage"
            options={stageOptions}
            error={e.lifeStage?.message}
            {...register('lifeStage')}
          />
          <SelectField
            label="Sex"
            options={SEXES.map((s) => ({ value: s, label: SEX_LABEL[s] }))}
            {...register('sex')}
          />
          <TextField
            label={
              group === 'tarantula' || group === 'true_spider'
                ? `Leg span (${unit})`
                : `Body length (${unit})`
            }
            inputMode="decimal"
            error={e.size?.message}
            {...register('size')}
          />
        </div>
        <TextField
          label="Clutch"
          hint="Slings from one egg sac share a clutch name."
          error={e.clutch?.message}
          {...register('clutch')}
        />
      </fieldset>

      <fieldset className="flex flex-col gap-3">
        <legend className="mb-1 text-xl font-extrabold">Where and from whom</legend>
        <PlacePicker
          legend="Place"
          places={locations}
          value={place}
          onChange={(c) => {
            setPlace(c);
            setShare(false);
          }}
          leaving={mine}
          optional
          errors={placeTried ? placeMissing : {}}
        />
        <TakenSpot
          where={place}
          names={taken}
          share={share}
          onShare={setShare}
          error={
            placeTried && taken.length > 0 && !share
              ? 'Tick to share the spot, or choose a free one.'
              : undefined
          }
        />
        <div className="grid grid-cols-2 gap-2">
          <TextField
            label="Acquired on"
            type="date"
            error={e.acquiredOn?.message}
            {...register('acquiredOn')}
          />
          <TextField label="Source" error={e.source?.message} {...register('source')} />
        </div>
      </fieldset>

      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-xl font-extrabold">Cautions</legend>
        {CAUTIONS.map((c) => (
          <label
            key={c}
            className="flex min-h-target cursor-pointer items-center gap-3 has-[:focus-visible]:outline has-[:focus-visible]:outline-4"
          >
            <input
              type="checkbox"
              value={c}
              className="size-6 accent-[var(--c-primary)]"
              {...register('cautions')}
            />
            {CAUTION_LABEL[c]}
          </label>
        ))}
        <TextField
          label="Other caution"
          hint="In your words, e.g. “Bolts up the lid”."
          error={e.cautionNote?.message}
          {...register('cautionNote')}
        />
      </fieldset>

      <fieldset className="flex flex-col gap-3">
        <legend className="mb-1 text-xl font-extrabold">Care</legend>
        <div className="grid grid-cols-2 gap-2">
          <TextField
            label="Feed every (days)"
            inputMode="numeric"
            hint="Empty: the round rules decide."
            error={e.intervalDays?.message}
            {...register('intervalDays')}
          />
          <TextField
            label="Prey count"
            inputMode="numeric"
            error={e.preyCount?.message}
            {...register('preyCount')}
          />
          <TextField label="Prey type" error={e.preyType?.message} {...register('preyType')} />
          <TextField label="Prey size" error={e.preySize?.message} {...register('preySize')} />
        </div>
        {hasDiet(group) && (
          <SelectField
            label="Diet"
            options={[
              {
                value: '',
                label: `Usual: ${DIET_LABEL[GROUP_CARE[group].defaultDiet].toLowerCase()}`,
              },
              ...DIETS.map((d) => ({ value: d, label: DIET_LABEL[d] })),
            ]}
            {...register('diet')}
          />
        )}
        <label className="flex min-h-target cursor-pointer items-center gap-3">
          <input
            type="checkbox"
            className="size-6 accent-[var(--c-primary)]"
            {...register('hasWaterDish')}
          />
          Has a water dish
        </label>
        <TextField
          label="Do not feed until"
          type="date"
          error={e.doNotFeedUntil?.message}
          {...register('doNotFeedUntil')}
        />
      </fieldset>

      <fieldset className="flex flex-col gap-3">
        <legend className="mb-1 text-xl font-extrabold">Enclosure</legend>
        <p className="text-sm">
          Inside size, so the round can ask for a bigger one after a molt. Height only for a
          climber’s tall enclosure.
        </p>
        <div className="grid grid-cols-2 gap-2">
          <TextField
            label={`Length (${unit})`}
            inputMode="decimal"
            error={e.enclosureLengthMm?.message}
            {...register('enclosureLengthMm')}
          />
          <TextField
            label={`Width (${unit})`}
            inputMode="decimal"
            error={e.enclosureWidthMm?.message}
            {...register('enclosureWidthMm')}
          />
          <TextField
            label={`Height (${unit})`}
            inputMode="decimal"
            hint="Arboreal only."
            error={e.enclosureHeightMm?.message}
            {...register('enclosureHeightMm')}
          />
        </div>
        <p className="text-sm">
          Every how many days? Empty: the care profile decides. 0: never for this animal.
        </p>
        <div className="grid grid-cols-2 gap-2">
          <TextField
            label="Mist every"
            inputMode="numeric"
            error={e.mistEveryDays?.message}
            {...register('mistEveryDays')}
          />
          <TextField
            label="Moisten substrate every"
            inputMode="numeric"
            error={e.moistenEveryDays?.message}
            {...register('moistenEveryDays')}
          />
          <TextField
            label="Spot-clean every"
            inputMode="numeric"
            error={e.spotCleanEveryDays?.message}
            {...register('spotCleanEveryDays')}
          />
        </div>
      </fieldset>

      <TextField label="Notes" error={e.notes?.message} {...register('notes')} />
      <div className="flex flex-col gap-2">
        <Button type="submit" busy={formState.isSubmitting}>
          {animal ? 'Save changes' : 'Add animal'}
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
