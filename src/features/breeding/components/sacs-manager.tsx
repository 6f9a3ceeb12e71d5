import { useState } from 'react';
import { GROUP_LABEL, type AnimalGroup } from '#shared/domain/animal-facts';
import { breedingModeOf, isOpenRecord, type BreedingMode, type BreedingRecordKind } from '#shared/domain/breeding';
import type { EggSacChange, EggSacView } from '#shared/schemas/breeding';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { Loading } from '@/components/ui/spinner';
import { TextField } from '@/components/ui/text-field';
import { useBreedingChanges, useEggSacs } from '../api/breeding-api';

const num = (v: string) => (v.trim() === '' ? null : Number(v));

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
  /** The new slings' ids, to print their labels. */
  onSlings: (animalIds: string[]) => void;
}

const A: Record<BreedingRecordKind, string> = { egg_sac: 'an egg sac', egg_case: 'an egg case', brood: 'a brood' };
const THE: Record<BreedingRecordKind, string> = { egg_sac: 'the sac', egg_case: 'the egg case', brood: 'the brood' };

/** What a female's record means for her on the round, in a sentence. */
function howSheIsTreated(mode: BreedingMode): string {
  if (mode.record === 'egg_case') return `A mantis does not guard her egg case: she stays on the round. Expect the hatch in about ${mode.window!.minDays / 7}–${mode.window!.maxDays / 7} weeks.`;
  if (mode.record === 'brood') return 'She is left alone while she guards her brood; her water dish is still topped up quietly. When it disperses, her rebuild (fed more often) starts by itself.';
  return 'She is left alone while she guards it; her water dish is still topped up quietly. When you pull it, or it hatches with her, her rebuild (fed more often) starts by itself.';
}

/** The dates and counts that mean something for this kind of record. */
function dateLine(sac: EggSacView, mode: BreedingMode) {
  const expected = sac.kind === 'brood' ? `disperses about ${sac.expectedFrom} to ${sac.expectedTo}` : `expected ${sac.expectedFrom} to ${sac.expectedTo}`;
  return [
    `${mode.words.startedOn} ${sac.laidOn}`,
    expected,
    sac.pulledOn && `pulled ${sac.pulledOn}`,
    sac.hatchedOn && `hatched ${sac.hatchedOn}`,
    sac.dispersedOn && `dispersed ${sac.dispersedOn}`,
  ]
    .filter(Boolean)
    .join(' · ');
}

function countLine(sac: EggSacView, mode: BreedingMode) {
  const young = mode.words.young;
  const parts =
    sac.kind === 'egg_sac'
      ? [`Eggs ${sac.eggCount ?? '—'}`, `with legs ${sac.eggsWithLegs ?? '—'}`, `slings ${sac.slingCount ?? '—'}`]
      : sac.kind === 'egg_case' || mode.words.count !== 'Eggs'
        ? [`${capitalise(young)} ${sac.slingCount ?? '—'}`]
        : [`Eggs ${sac.eggCount ?? '—'}`, `${young} ${sac.slingCount ?? '—'}`];
  return [...parts, `potted up ${sac.slingsCreated}`].join(' · ');
}
const capitalise = (w: string) => w.charAt(0).toUpperCase() + w.slice(1);

function SacCard({ sac, today, collectionId, onSlings }: { sac: EggSacView; today: string; collectionId: string; onSlings: Props['onSlings'] }) {
  const change = useBreedingChanges(collectionId);
  const mode = breedingModeOf(sac.femaleGroup);
  const [open, setOpen] = useState<'update' | 'slings' | null>(null);
  const [u, setU] = useState({ laidOn: sac.laidOn, pulledOn: sac.pulledOn ?? '', hatchedOn: sac.hatchedOn ?? '', dispersedOn: sac.dispersedOn ?? '', eggCount: sac.eggCount?.toString() ?? '', eggsWithLegs: sac.eggsWithLegs?.toString() ?? '', slingCount: sac.slingCount?.toString() ?? '', minDays: String(sac.incubationMinDays), maxDays: String(sac.incubationMaxDays) });
  const [s, setS] = useState({ count: String(sac.slingCount ?? sac.eggsWithLegs ?? 24), namePrefix: sac.femaleName, room: '', rack: '', shelf: '', firstPosition: '1' });
  const due = isOpenRecord(sac) && today >= sac.expectedFrom;
  const error = change.change.error ?? change.slings.error;
  const young = mode.words.young;
  const kindBody = (): EggSacChange => {
    const d = (v: string) => v || null;
    if (sac.kind === 'egg_sac') return { pulledOn: d(u.pulledOn), hatchedOn: d(u.hatchedOn), eggCount: num(u.eggCount), eggsWithLegs: num(u.eggsWithLegs), slingCount: num(u.slingCount) };
    if (sac.kind === 'egg_case') return { hatchedOn: d(u.hatchedOn), slingCount: num(u.slingCount) };
    return { dispersedOn: d(u.dispersedOn), slingCount: num(u.slingCount), ...(mode.words.count === 'Eggs' ? { hatchedOn: d(u.hatchedOn), eggCount: num(u.eggCount) } : {}) };
  };
  return (
    <li className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3">
      <p className="font-extrabold">
        {sac.clutch} · {sac.femaleName}
        <span className="ml-2 inline-block rounded-md border-2 border-border px-1.5 text-sm font-bold">{mode.words.record}</span>
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
        <form
          aria-label={`Update ${sac.clutch}`}
          className="grid grid-cols-2 gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            change.change.mutate({ sacId: sac.id, body: { laidOn: u.laidOn, ...kindBody(), incubation: { minDays: Number(u.minDays), maxDays: Number(u.maxDays) } } }, { onSuccess: () => setOpen(null) });
          }}
        >
          <TextField label={mode.words.startedOn} type="date" max={today} value={u.laidOn} onChange={(e) => setU((x) => ({ ...x, laidOn: e.target.value }))} />
          {sac.kind === 'egg_sac' && <TextField label="Pulled on" type="date" max={today} value={u.pulledOn} onChange={(e) => setU((x) => ({ ...x, pulledOn: e.target.value }))} />}
          {(sac.kind !== 'brood' || mode.words.count === 'Eggs') && <TextField label="Hatched on" type="date" max={today} value={u.hatchedOn} onChange={(e) => setU((x) => ({ ...x, hatchedOn: e.target.value }))} />}
          {sac.kind === 'brood' && <TextField label="Dispersed on" type="date" max={today} value={u.dispersedOn} onChange={(e) => setU((x) => ({ ...x, dispersedOn: e.target.value }))} />}
          {(sac.kind === 'egg_sac' || mode.words.count === 'Eggs') && <TextField label="Eggs" inputMode="numeric" value={u.eggCount} onChange={(e) => setU((x) => ({ ...x, eggCount: e.target.value }))} />}
          {sac.kind === 'egg_sac' && <TextField label="Eggs with legs" inputMode="numeric" value={u.eggsWithLegs} onChange={(e) => setU((x) => ({ ...x, eggsWithLegs: e.target.value }))} />}
          <TextField label={capitalise(young)} inputMode="numeric" value={u.slingCount} onChange={(e) => setU((x) => ({ ...x, slingCount: e.target.value }))} />
          <TextField label={sac.kind === 'brood' ? 'Dispersal from (days)' : 'Incubation from (days)'} inputMode="numeric" value={u.minDays} onChange={(e) => setU((x) => ({ ...x, minDays: e.target.value }))} />
          <TextField label="to (days)" inputMode="numeric" value={u.maxDays} onChange={(e) => setU((x) => ({ ...x, maxDays: e.target.value }))} />
          <Button type="submit" className="col-span-2" busy={change.change.isPending}>
            Save
          </Button>
        </form>
      )}
      {open === 'slings' && (
        <form
          aria-label={`Pot up ${young} from ${sac.clutch}`}
          className="grid grid-cols-2 gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            change.slings.mutate(
              { sacId: sac.id, body: { count: Number(s.count), namePrefix: s.namePrefix, room: s.room, rack: s.rack, shelf: s.shelf, firstPosition: Number(s.firstPosition) } },
              { onSuccess: (r) => onSlings(r.animalIds) },
            );
          }}
        >
          <TextField label="How many" inputMode="numeric" value={s.count} onChange={(e) => setS((x) => ({ ...x, count: e.target.value }))} />
          <TextField label="Names start with" value={s.namePrefix} onChange={(e) => setS((x) => ({ ...x, namePrefix: e.target.value }))} />
          <TextField label="Room" value={s.room} onChange={(e) => setS((x) => ({ ...x, room: e.target.value }))} />
          <TextField label="Rack" value={s.rack} onChange={(e) => setS((x) => ({ ...x, rack: e.target.value }))} />
          <TextField label="Tray or shelf" value={s.shelf} onChange={(e) => setS((x) => ({ ...x, shelf: e.target.value }))} />
          <TextField label="First position" inputMode="numeric" value={s.firstPosition} onChange={(e) => setS((x) => ({ ...x, firstPosition: e.target.value }))} />
          <p className="col-span-2 text-sm text-muted">One record per pot, numbered in order, codes in sequence, all at once or none. Then print their labels.</p>
          <Button type="submit" className="col-span-2" busy={change.slings.isPending}>
            Create {s.count} {young}
          </Button>
        </form>
      )}
      {error && <Notice tone="error" title={(error as { issues?: { message: string }[] }).issues?.[0]?.message ?? error.message} />}
    </li>
  );
}

/** Egg sacs, egg cases and broods from laying (or birth) to potting up, after each female's group. */
export function SacsManager({ collectionId, today, females, onSlings }: Props) {
  const sacs = useEggSacs(collectionId);
  const change = useBreedingChanges(collectionId);
  const [draft, setDraft] = useState({ femaleId: females[0]?.id ?? '', laidOn: today, clutch: '', count: '' });
  const female = females.find((f) => f.id === draft.femaleId) ?? females[0];
  const mode = breedingModeOf(female?.group ?? 'tarantula');
  const kind = mode.record ?? 'egg_sac';
  const countField = kind === 'brood' && mode.words.count === 'Scorplings' ? 'slingCount' : 'eggCount';
  return (
    <div className="flex flex-col gap-4">
      <form
        aria-labelledby="new-sac-heading"
        className="flex flex-col gap-2 rounded-2xl border-2 border-border p-3"
        onSubmit={(e) => {
          e.preventDefault();
          if (!female) return;
          change.create.mutate(
            { femaleId: female.id, laidOn: draft.laidOn, clutch: draft.clutch || undefined, ...(mode.words.count && draft.count.trim() ? { [countField]: num(draft.count) } : {}) },
            { onSuccess: () => setDraft((d) => ({ ...d, clutch: '', count: '' })) },
          );
        }}
      >
        <h2 id="new-sac-heading" className="text-xl font-extrabold">
          Record {A[kind]}
        </h2>
        {females.length ? (
          <SelectField label="Female" value={female?.id ?? ''} onChange={(e) => setDraft((d) => ({ ...d, femaleId: e.target.value }))} options={females.map((f) => ({ value: f.id, label: `${f.name} (${f.labelCode})${f.group === 'tarantula' ? '' : ` · ${GROUP_LABEL[f.group]}`}` }))} />
        ) : (
          <Notice tone="info" title="No female to choose yet. Sacs, egg cases and broods are recorded for animals recorded as female: tarantulas, true spiders, mantids, scorpions and centipedes." />
        )}
        <TextField label={mode.words.startedOn} type="date" max={today} value={draft.laidOn} onChange={(e) => setDraft((d) => ({ ...d, laidOn: e.target.value }))} />
        {mode.words.count && kind === 'brood' && <TextField label={mode.words.count} inputMode="numeric" value={draft.count} onChange={(e) => setDraft((d) => ({ ...d, count: e.target.value }))} />}
        <TextField label="Clutch name" hint={`Its ${mode.words.young} share it. Empty: the female's name and the date.`} value={draft.clutch} onChange={(e) => setDraft((d) => ({ ...d, clutch: e.target.value }))} />
        <p className="text-sm text-muted">{howSheIsTreated(mode)}</p>
        {change.create.isError && <Notice tone="error" title={change.create.error.message} />}
        <Button type="submit" disabled={!female} busy={change.create.isPending}>
          Record {THE[kind]}
        </Button>
      </form>
      {sacs.isPending && <Loading />}
      {sacs.isError && <Notice tone="error" title={sacs.error.message} />}
      <ul aria-label="Egg sacs, egg cases and broods" className="flex flex-col gap-2">
        {sacs.data?.sacs.map((sac) => <SacCard key={sac.id} sac={sac} today={today} collectionId={collectionId} onSlings={onSlings} />)}
      </ul>
    </div>
  );
}
