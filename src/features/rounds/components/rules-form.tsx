import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useState } from 'react';
import {
  get,
  useFieldArray,
  useForm,
  type FieldError,
  type FieldErrors,
  type FieldValues,
  type Resolver,
} from 'react-hook-form';
import { z } from 'zod';
import {
  ANIMAL_GROUPS,
  GROUP_LABEL,
  stageLabel,
  type AnimalGroup,
} from '#shared/domain/animal-facts';
import type { RoundRules, RulesOverride } from '#shared/domain/rounds/rules';
import { rulesOverride, type RulesOverrideBody } from '#shared/schemas/rules';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useSaveRules, type RulesResponse } from '../api/rules';
import {
  DIET_KEYS,
  fedStages,
  flattenDraft,
  groupOfPath,
  isTextField,
  nestDraft,
  offerPath,
  profilePath,
  SINGLE_KEYS,
  stagePath,
  toDraft,
  toOverrides,
  type SingleKey,
  type StageNumberKey,
} from '../rules-draft';

const STAGE_RULES: { key: StageNumberKey; title: string; explain: string; unit: string }[] = [
  {
    key: 'feedEveryDays',
    title: 'Feeding interval',
    explain: 'Feed again this many days after the last meal.',
    unit: 'days',
  },
  {
    key: 'refusalRetryDays',
    title: 'After a refusal',
    explain: 'Offer food again this many days after a refusal.',
    unit: 'days',
  },
  {
    key: 'refusalStreak',
    title: 'Refusals in a row',
    explain:
      'This many refusals in a row flag a possible premolt: food stops and a check goes on the round. Never for mature males or adults that no longer molt.',
    unit: 'refusals',
  },
  {
    key: 'postMoltHoldDays',
    title: 'Post-molt hold',
    explain: 'No food for this many days after a molt, while the fangs or mouthparts harden.',
    unit: 'days',
  },
];

const SINGLE_RULES: Record<SingleKey, { title: string; explain: string }> = {
  settlingDays: {
    title: 'Settling (days)',
    explain:
      'No food for this many days after an animal joins the collection, is potted up or is rehoused. 0 turns it off.',
  },
  preyStayCheckDays: {
    title: 'Check prey left in (days)',
    explain: 'A roach allowed to stay with an adult is checked this many days later.',
  },
  premoltCheckDays: {
    title: 'Premolt check (days)',
    explain: 'While a possible premolt is flagged, look at the animal this often.',
  },
  waterEveryDays: {
    title: 'Water dishes every (days)',
    explain: 'Top up water dishes this often.',
  },
  rebuildFactor: {
    title: 'Rebuild factor',
    explain:
      'After an egg sac is pulled or a pairing, the interval is multiplied by this (0.5 = twice as often).',
  },
  rebuildDays: { title: 'Rebuild period (days)', explain: 'How long the shorter interval lasts.' },
  substrateCheckDays: {
    title: 'Larva substrate check (days)',
    explain: 'Beetle larvae: check and top up their food substrate this often.',
  },
  bolusAfterDays: {
    title: 'Bolus pick-out (days after a meal)',
    explain: 'The spot-clean after a meal of live prey; 0: none.',
  },
  rehouseFloorSpans: {
    title: 'Rehouse: floor (× size)',
    explain:
      'After a molt, rehouse when the floor’s shorter side is under this many times its size.',
  },
  rehouseHeightSpans: {
    title: 'Rehouse: height (× size)',
    explain:
      'For a tall enclosure (height recorded): rehouse when lower than this many times its size.',
  },
  spanToBody: {
    title: 'Body share of leg span',
    explain:
      'A spider’s body is about this share of its leg span; prey is no longer than the body.',
  },
  tinySlingMm: {
    title: 'Tiny sling (mm)',
    explain: 'Tarantula slings smaller than this get fruit-fly larvae.',
  },
};

const DIET_WORDS: Record<(typeof DIET_KEYS)[number], string> = {
  fruit_jelly: 'Fruit or jelly (days)',
  plant: 'Plant food (days)',
  detritus: 'Leaf litter (days)',
};

const HYDRATION_OPTIONS = [
  { value: 'moisten', label: 'Moisten the substrate' },
  { value: 'mist', label: 'Mist' },
  { value: 'none', label: 'Nothing' },
];

function Box({
  title,
  explain,
  children,
}: {
  title: string;
  explain?: string;
  children: React.ReactNode;
}) {
  return (
    <fieldset className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3">
      <legend className="px-1 text-lg font-extrabold">{title}</legend>
      {explain && <p className="text-sm text-muted">{explain}</p>}
      {children}
    </fieldset>
  );
}

/** The paths of the fields that carry a message, e.g. `profiles.mantis.hydrateEveryDays`. */
function errorPaths(errors: FieldErrors, prefix = ''): string[] {
  return Object.entries(errors).flatMap(([key, value]) => {
    const path = prefix ? `${prefix}.${key}` : key;
    if (!value || typeof value !== 'object') return [];
    return typeof (value as FieldError).message === 'string'
      ? [path]
      : errorPaths(value as FieldErrors, path);
  });
}

const notANumber = (raw: string | undefined) =>
  raw !== undefined && (raw.trim() === '' || Number.isNaN(Number(raw.replace(',', '.'))));

/**
 * The form's text turned into the overrides the API stores and checked by the API's own schema;
 * a box that holds no number then says so plainly instead of naming the bound it misses.
 */
function rulesResolver(defaults: RoundRules): Resolver<FieldValues, unknown, RulesOverrideBody> {
  const check = zodResolver(
    z
      .custom<FieldValues>()
      .transform((values) => toOverrides(flattenDraft(values), defaults))
      .pipe(rulesOverride),
  );
  return async (values, context, options) => {
    const result = await check(values, context, options);
    const draft = flattenDraft(values);
    for (const path of errorPaths(result.errors)) {
      if (!isTextField(path) && notANumber(draft[path]))
        (get(result.errors, path) as FieldError).message = 'Enter a number.';
    }
    return result;
  };
}

export function RulesForm({ collectionId, data }: { collectionId: string; data: RulesResponse }) {
  const save = useSaveRules(collectionId);
  const resolver = useMemo(() => rulesResolver(data.defaults), [data.defaults]);
  const { register, control, handleSubmit, reset, setError, formState } = useForm<
    FieldValues,
    unknown,
    RulesOverrideBody
  >({
    resolver,
    defaultValues: nestDraft(toDraft(data.rules)),
  });
  const feeders = useFieldArray({ control, name: 'feeders' });
  const { problem, attempt } = useServerProblem(setError);
  const [group, setGroup] = useState<AnimalGroup>('tarantula');
  const defaults = toDraft(data.defaults);
  const field = (key: string, label: string, extra: { hint?: string; numeric?: boolean } = {}) => (
    <TextField
      key={key}
      label={label}
      hint={extra.hint}
      inputMode={extra.numeric === false ? 'text' : 'decimal'}
      error={(get(formState.errors, key) as FieldError | undefined)?.message}
      {...register(key)}
    />
  );

  const submit = handleSubmit(
    (overrides) => attempt(() => save.mutateAsync(overrides as RulesOverride)),
    (errors) => {
      // Show a group whose field needs attention when the one on screen has none.
      const paths = errorPaths(errors);
      const first = paths.map(groupOfPath).find((g) => g !== null);
      if (first && !paths.some((p) => groupOfPath(p) === group)) setGroup(first);
    },
  );

  const stages = fedStages(data.defaults, group);
  const problems = errorPaths(formState.errors).length;
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-5">
      <p className="text-sm text-muted">
        What each value means, and where it comes from, is in the care rules (docs/care-rules.md).
        An animal’s own care settings come first.
      </p>
      <SelectField
        label="Care profile of"
        value={group}
        onChange={(e) => setGroup(e.target.value as AnimalGroup)}
        options={ANIMAL_GROUPS.map((g) => ({ value: g, label: GROUP_LABEL[g] }))}
      />
      {STAGE_RULES.map(({ key, title, explain, unit }) => (
        <Box key={key} title={title} explain={explain}>
          <div className="grid grid-cols-2 gap-3">
            {stages.map((s) =>
              field(stagePath(group, s, key), `${stageLabel(group, s)} (${unit})`, {
                hint: `Default ${defaults[stagePath(group, s, key)]}`,
              }),
            )}
          </div>
        </Box>
      ))}
      <Box
        title="What to offer"
        explain="Prey no longer than the animal’s body: with a size on record, the size comes from the feeder catalogue below; these sizes are for animals without one."
      >
        {stages.map((s) => (
          <div key={s} className="grid grid-cols-2 gap-3">
            <p className="col-span-2 font-bold">{stageLabel(group, s)}</p>
            {field(offerPath(group, s, 'preyType'), 'Prey', { numeric: false })}
            {field(offerPath(group, s, 'preySize'), 'Size', { numeric: false })}
            {field(offerPath(group, s, 'countMin'), 'At least')}
            {field(offerPath(group, s, 'countMax'), 'At most')}
          </div>
        ))}
      </Box>
      <Box
        title="Water without a dish"
        explain="Animals with a dish get the dish topped up. Without one, this group gets:"
      >
        <SelectField
          key={group}
          label="Task"
          options={HYDRATION_OPTIONS}
          {...register(profilePath(group, 'hydration'))}
        />
        <div className="grid grid-cols-2 gap-3">
          {field(profilePath(group, 'hydrateEveryDays'), 'Every (days)', {
            hint: `Default ${defaults[profilePath(group, 'hydrateEveryDays')]}`,
          })}
          {field(profilePath(group, 'hydrateBelowMm'), 'Only below (mm)', {
            hint: 'Empty: every size.',
          })}
        </div>
      </Box>

      <Box
        title="Spot-clean"
        explain="Waste, remains and old molts picked out on a schedule (and a bolus the day after a meal)."
      >
        {field(profilePath(group, 'spotCleanEveryDays'), 'Every (days)', {
          hint: 'Empty: only after meals.',
        })}
      </Box>

      <h2 className="text-2xl font-extrabold">Every group</h2>
      {SINGLE_KEYS.map((key) => (
        <Box key={key} title={SINGLE_RULES[key].title}>
          {field(key, SINGLE_RULES[key].title, {
            hint: `${SINGLE_RULES[key].explain} Default ${defaults[key]}.`,
          })}
        </Box>
      ))}
      <Box
        title="Diets"
        explain="Beetle adults and other animals fed by diet: how often their food is replaced."
      >
        <div className="grid grid-cols-2 gap-3">
          {DIET_KEYS.map((k) =>
            field(`dietEveryDays.${k}`, DIET_WORDS[k], {
              hint: `Default ${defaults[`dietEveryDays.${k}`]}`,
            }),
          )}
        </div>
      </Box>
      <Box
        title="Feeder catalogue"
        explain="The feeders you keep and their usual body length. Offers pick the largest size no longer than the animal’s body."
      >
        {feeders.fields.map((row, i) => (
          <div
            key={row.id}
            className="grid grid-cols-2 items-end gap-3 border-b-2 border-border pb-3"
          >
            {field(`feeders.${i}.preyType`, `Feeder ${i + 1}: prey`, { numeric: false })}
            {field(`feeders.${i}.preySize`, `Feeder ${i + 1}: size`, { numeric: false })}
            {field(`feeders.${i}.lengthMm`, `Feeder ${i + 1}: length (mm)`)}
            <Button type="button" variant="quiet" onClick={() => feeders.remove(i)}>
              Remove feeder {i + 1}
            </Button>
          </div>
        ))}
        <Button
          type="button"
          variant="secondary"
          onClick={() =>
            feeders.append({ preyType: '', preySize: '', lengthMm: '' }, { shouldFocus: false })
          }
        >
          Add a feeder size
        </Button>
      </Box>
      {problems > 0 && (
        <Notice
          tone="error"
          title={`${problems} ${problems === 1 ? 'field needs' : 'fields need'} attention.`}
        />
      )}
      {problem && <Notice tone="error" title={problem} />}
      {save.isSuccess && (
        <Notice
          tone="ok"
          title="Rules saved. Tomorrow’s round follows them; today’s stays as it was built."
        />
      )}
      <div className="sticky bottom-20 flex gap-3 bg-bg py-2">
        <Button
          type="button"
          variant="secondary"
          onClick={() => reset(nestDraft(toDraft(data.defaults)))}
        >
          Use defaults
        </Button>
        <Button type="submit" wide busy={formState.isSubmitting}>
          Save rules
        </Button>
      </div>
    </form>
  );
}
