import { useState } from 'react';
import type { EggSacView } from '#shared/schemas/breeding';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { Loading } from '@/components/ui/spinner';
import { TextField } from '@/components/ui/text-field';
import { useBreedingChanges, useEggSacs } from '../api/breeding-api';

const num = (v: string) => (v.trim() === '' ? null : Number(v));

interface Props {
  collectionId: string;
  today: string;
  females: readonly { id: string; name: string; labelCode: string }[];
  /** The new slings' ids, to print their labels. */
  onSlings: (animalIds: string[]) => void;
}

function SacCard({ sac, today, collectionId, onSlings }: { sac: EggSacView; today: string; collectionId: string; onSlings: Props['onSlings'] }) {
  const change = useBreedingChanges(collectionId);
  const [open, setOpen] = useState<'update' | 'slings' | null>(null);
  const [u, setU] = useState({ pulledOn: sac.pulledOn ?? '', hatchedOn: sac.hatchedOn ?? '', eggCount: sac.eggCount?.toString() ?? '', eggsWithLegs: sac.eggsWithLegs?.toString() ?? '', slingCount: sac.slingCount?.toString() ?? '', minDays: String(sac.incubationMinDays), maxDays: String(sac.incubationMaxDays) });
  const [s, setS] = useState({ count: String(sac.slingCount ?? sac.eggsWithLegs ?? 24), namePrefix: sac.femaleName, room: '', rack: '', shelf: '', firstPosition: '1' });
  const due = !sac.pulledOn && !sac.hatchedOn && today >= sac.expectedFrom;
  const error = change.change.error ?? change.slings.error;
  return (
    <li className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3">
      <p className="font-extrabold">
        {sac.clutch} · {sac.femaleName}
      </p>
      <p className="text-sm">
        Laid {sac.laidOn} · expected {sac.expectedFrom} to {sac.expectedTo}
        {sac.pulledOn && ` · pulled ${sac.pulledOn}`}
        {sac.hatchedOn && ` · hatched ${sac.hatchedOn}`}
      </p>
      {due && <p className="font-bold text-accent">Due: check the sac.</p>}
      <p className="text-sm text-muted">
        Eggs {sac.eggCount ?? '—'} · with legs {sac.eggsWithLegs ?? '—'} · slings {sac.slingCount ?? '—'} · potted up {sac.slingsCreated}
      </p>
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" onClick={() => setOpen(open === 'update' ? null : 'update')}>
          Update…
        </Button>
        <Button variant="secondary" onClick={() => setOpen(open === 'slings' ? null : 'slings')}>
          Pot up slings…
        </Button>
      </div>
      {open === 'update' && (
        <form
          className="grid grid-cols-2 gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            change.change.mutate(
              {
                sacId: sac.id,
                body: { pulledOn: u.pulledOn || null, hatchedOn: u.hatchedOn || null, eggCount: num(u.eggCount), eggsWithLegs: num(u.eggsWithLegs), slingCount: num(u.slingCount), incubation: { minDays: Number(u.minDays), maxDays: Number(u.maxDays) } },
              },
              { onSuccess: () => setOpen(null) },
            );
          }}
        >
          <TextField label="Pulled on" type="date" value={u.pulledOn} onChange={(e) => setU((x) => ({ ...x, pulledOn: e.target.value }))} />
          <TextField label="Hatched on" type="date" value={u.hatchedOn} onChange={(e) => setU((x) => ({ ...x, hatchedOn: e.target.value }))} />
          <TextField label="Eggs" inputMode="numeric" value={u.eggCount} onChange={(e) => setU((x) => ({ ...x, eggCount: e.target.value }))} />
          <TextField label="Eggs with legs" inputMode="numeric" value={u.eggsWithLegs} onChange={(e) => setU((x) => ({ ...x, eggsWithLegs: e.target.value }))} />
          <TextField label="Slings" inputMode="numeric" value={u.slingCount} onChange={(e) => setU((x) => ({ ...x, slingCount: e.target.value }))} />
          <span />
          <TextField label="Incubation from (days)" inputMode="numeric" value={u.minDays} onChange={(e) => setU((x) => ({ ...x, minDays: e.target.value }))} />
          <TextField label="to (days)" inputMode="numeric" value={u.maxDays} onChange={(e) => setU((x) => ({ ...x, maxDays: e.target.value }))} />
          <Button type="submit" className="col-span-2" busy={change.change.isPending}>
            Save
          </Button>
        </form>
      )}
      {open === 'slings' && (
        <form
          aria-label={`Pot up slings from ${sac.clutch}`}
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
            Create {s.count} slings
          </Button>
        </form>
      )}
      {error && <Notice tone="error" title={(error as { issues?: { message: string }[] }).issues?.[0]?.message ?? error.message} />}
    </li>
  );
}

/** Egg sacs from laying to potting up, with the collection's usual incubation window. */
export function SacsManager({ collectionId, today, females, onSlings }: Props) {
  const sacs = useEggSacs(collectionId);
  const change = useBreedingChanges(collectionId);
  const [draft, setDraft] = useState({ femaleId: females[0]?.id ?? '', laidOn: today, clutch: '' });
  return (
    <div className="flex flex-col gap-4">
      <form
        className="flex flex-col gap-2 rounded-2xl border-2 border-border p-3"
        onSubmit={(e) => {
          e.preventDefault();
          change.create.mutate({ femaleId: draft.femaleId, laidOn: draft.laidOn, clutch: draft.clutch || undefined }, { onSuccess: () => setDraft((d) => ({ ...d, clutch: '' })) });
        }}
      >
        <h2 className="text-xl font-extrabold">Record an egg sac</h2>
        <SelectField label="Female" value={draft.femaleId} onChange={(e) => setDraft((d) => ({ ...d, femaleId: e.target.value }))} options={females.map((f) => ({ value: f.id, label: `${f.name} (${f.labelCode})` }))} />
        <TextField label="Laid on" type="date" max={today} value={draft.laidOn} onChange={(e) => setDraft((d) => ({ ...d, laidOn: e.target.value }))} />
        <TextField label="Clutch name" hint="Its slings share it. Empty: the female's name and the date." value={draft.clutch} onChange={(e) => setDraft((d) => ({ ...d, clutch: e.target.value }))} />
        <p className="text-sm text-muted">She is left alone while she guards it; when you pull it, her rebuild (fed more often) starts by itself.</p>
        {change.create.isError && <Notice tone="error" title={change.create.error.message} />}
        <Button type="submit" disabled={!draft.femaleId} busy={change.create.isPending}>
          Record the sac
        </Button>
      </form>
      {sacs.isPending && <Loading />}
      {sacs.isError && <Notice tone="error" title={sacs.error.message} />}
      <ul aria-label="Egg sacs" className="flex flex-col gap-2">
        {sacs.data?.sacs.map((sac) => <SacCard key={sac.id} sac={sac} today={today} collectionId={collectionId} onSlings={onSlings} />)}
      </ul>
    </div>
  );
}
