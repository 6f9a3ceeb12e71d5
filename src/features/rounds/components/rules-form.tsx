import { useState } from 'react';
import { LIFE_STAGES, STAGE_LABEL, type LifeStage } from '#shared/domain/animal-facts';
import type { Offer, RoundRules, RulesOverride } from '#shared/domain/rounds/rules';
import { rulesOverride } from '#shared/schemas/rules';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { useSaveRules, type RulesResponse } from '../api/rules';

type StageKey = 'intervalDays' | 'refusalRetryDays' | 'refusalStreak' | 'postMoltHoldDays';
type SingleKey = 'premoltCheckDays' | 'waterEveryDays' | 'rebuildFactor' | 'rebuildDays';

const STAGE_RULES: { key: StageKey; title: string; explain: string; unit: string }[] = [
  { key: 'intervalDays', title: 'Feeding interval', explain: 'Feed again this many days after the last meal.', unit: 'days' },
  { key: 'refusalRetryDays', title: 'After a refusal', explain: 'Offer food again this many days after a refusal.', unit: 'days' },
  {
    key: 'refusalStreak',
    title: 'Refusals in a row',
    explain: 'This many refusals in a row flag a possible premolt: food stops and a check goes on the round.',
    unit: 'refusals',
  },
  { key: 'postMoltHoldDays', title: 'Post-molt hold', explain: 'No food for this many days after a molt, while the fangs harden.', unit: 'days' },
];

const SINGLE_RULES: { key: SingleKey; title: string; explain: string }[] = [
  { key: 'premoltCheckDays', title: 'Premolt check (days)', explain: 'While a possible premolt is flagged, look at the animal this often.' },
  { key: 'waterEveryDays', title: 'Water every (days)', explain: 'Top up water dishes this often. Small slings have no dish.' },
  { key: 'rebuildFactor', title: 'Rebuild factor', explain: 'After an egg sac is pulled or a pairing, the interval is multiplied by this (0.5 = twice as often).' },
  { key: 'rebuildDays', title: 'Rebuild period (days)', explain: 'How long the shorter interval lasts.' },
];

const GROUPS = ['centipede', 'scorpion', 'mantis'] as const;

type Draft = Record<string, string>;

function toDraft(r: RoundRules): Draft {
  const d: Draft = {};
  for (const { key } of STAGE_RULES) for (const s of LIFE_STAGES) d[`${key}.${s}`] = String(r[key][s]);
  for (const { key } of SINGLE_RULES) d[key] = String(r[key]);
  for (const g of GROUPS) d[`groupIntervalDays.${g}`] = String(r.groupIntervalDays[g] ?? '');
  for (const s of LIFE_STAGES) for (const f of ['preyType', 'preySize', 'countMin', 'countMax'] as const) d[`offers.${s}.${f}`] = String(r.offers[s][f]);
  return d;
}

/** Only what differs from the defaults is stored: a later change of default still reaches us. */
function toOverrides(d: Draft, defaults: RoundRules): RulesOverride {
  const out: Record<string, unknown> = {};
  const num = (k: string) => (d[k]!.trim() === '' ? NaN : Number(d[k]));
  for (const { key } of STAGE_RULES) {
    const changed = Object.fromEntries(LIFE_STAGES.filter((s) => num(`${key}.${s}`) !== defaults[key][s]).map((s) => [s, num(`${key}.${s}`)]));
    if (Object.keys(changed).length) out[key] = changed;
  }
  for (const { key } of SINGLE_RULES) if (num(key) !== defaults[key]) out[key] = num(key);
  const groups = Object.fromEntries(GROUPS.filter((g) => num(`groupIntervalDays.${g}`) !== defaults.groupIntervalDays[g]).map((g) => [g, num(`groupIntervalDays.${g}`)]));
  if (Object.keys(groups).length) out.groupIntervalDays = groups;
  const offers: Partial<Record<LifeStage, Offer>> = {};
  for (const s of LIFE_STAGES) {
    const o: Offer = {
      preyType: d[`offers.${s}.preyType`]!.trim(),
      preySize: d[`offers.${s}.preySize`]!.trim(),
      countMin: num(`offers.${s}.countMin`),
      countMax: num(`offers.${s}.countMax`),
    };
    if (JSON.stringify(o) !== JSON.stringify(defaults.offers[s])) offers[s] = o;
  }
  if (Object.keys(offers).length) out.offers = offers;
  return out as RulesOverride;
}

export function RulesForm({ collectionId, data }: { collectionId: string; data: RulesResponse }) {
  const save = useSaveRules(collectionId);
  const [draft, setDraft] = useState<Draft>(() => toDraft(data.rules));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const field = (key: string, label: string, extra: { hint?: string; numeric?: boolean } = {}) => (
    <TextField
      key={key}
      label={label}
      hint={extra.hint}
      inputMode={extra.numeric === false ? 'text' : 'decimal'}
      value={draft[key] ?? ''}
      error={errors[key]}
      onChange={(e) => setDraft((d) => ({ ...d, [key]: e.target.value }))}
    />
  );

  function submit(e: React.FormEvent) {
    e.preventDefault();
    const overrides = toOverrides(draft, data.defaults);
    const parsed = rulesOverride.safeParse(overrides);
    if (!parsed.success) {
      setErrors(
        Object.fromEntries(
          parsed.error.issues.map((i) => {
            const key = i.path.join('.');
            const raw = draft[key];
            const textual = /\.(preyType|preySize)$/.test(key);
            const notANumber = !textual && raw !== undefined && (raw.trim() === '' || Number.isNaN(Number(raw)));
            return [key, notANumber ? 'Enter a number.' : i.message];
          }),
        ),
      );
      return;
    }
    setErrors({});
    save.mutate(parsed.data as RulesOverride);
  }

  const problems = Object.keys(errors).length;
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-5">
      {STAGE_RULES.map(({ key, title, explain, unit }) => (
        <fieldset key={key} className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3">
          <legend className="px-1 text-lg font-extrabold">{title}</legend>
          <p className="text-sm text-muted">{explain}</p>
          <div className="grid grid-cols-2 gap-3">
            {LIFE_STAGES.map((s) => field(`${key}.${s}`, `${STAGE_LABEL[s]} (${unit})`, { hint: `Default ${data.defaults[key][s]}` }))}
          </div>
        </fieldset>
      ))}
      <fieldset className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3">
        <legend className="px-1 text-lg font-extrabold">Other groups</legend>
        <p className="text-sm text-muted">Centipedes, scorpions and mantids have their own feeding interval (days), whatever their stage.</p>
        <div className="grid grid-cols-2 gap-3">
          {GROUPS.map((g) => field(`groupIntervalDays.${g}`, g[0]!.toUpperCase() + g.slice(1), { hint: `Default ${data.defaults.groupIntervalDays[g]}` }))}
        </div>
      </fieldset>
      {SINGLE_RULES.map(({ key, title, explain }) => (
        <fieldset key={key} className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3">
          <legend className="px-1 text-lg font-extrabold">{title}</legend>
          {field(key, title, { hint: `${explain} Default ${data.defaults[key]}.` })}
        </fieldset>
      ))}
      <fieldset className="flex flex-col gap-3 rounded-2xl border-2 border-border bg-surface p-3">
        <legend className="px-1 text-lg font-extrabold">What to offer</legend>
        <p className="text-sm text-muted">Prey no larger than the animal’s body. An animal’s own setting comes first.</p>
        {LIFE_STAGES.map((s) => (
          <div key={s} className="grid grid-cols-2 gap-3">
            <p className="col-span-2 font-bold">{STAGE_LABEL[s]}</p>
            {field(`offers.${s}.preyType`, 'Prey', { numeric: false })}
            {field(`offers.${s}.preySize`, 'Size', { numeric: false })}
            {field(`offers.${s}.countMin`, 'At least')}
            {field(`offers.${s}.countMax`, 'At most')}
          </div>
        ))}
      </fieldset>
      {problems > 0 && <Notice tone="error" title={`${problems} ${problems === 1 ? 'field needs' : 'fields need'} attention.`} />}
      {save.isError && <Notice tone="error" title={save.error.message} />}
      {save.isSuccess && <Notice tone="ok" title="Rules saved. Tomorrow’s round follows them; today’s stays as it was built." />}
      <div className="sticky bottom-20 flex gap-3 bg-bg py-2">
        <Button type="button" variant="secondary" onClick={() => setDraft(toDraft(data.defaults))}>
          Use defaults
        </Button>
        <Button type="submit" wide busy={save.isPending}>
          Save rules
        </Button>
      </div>
    </form>
  );
}
