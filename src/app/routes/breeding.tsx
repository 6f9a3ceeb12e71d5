import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { canBreed } from '#shared/domain/breeding';
import { localDateOf } from '#shared/domain/local-dates';
import { useShell } from '@/app/layout/use-shell';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { TextField } from '@/components/ui/text-field';
import { useAnimalList } from '@/features/animals/api/list-animals';
import { useBreedingChanges, useEggSacs } from '@/features/breeding/api/breeding-api';
import { Insights } from '@/features/breeding/components/insights';
import { SacsManager } from '@/features/breeding/components/sacs-manager';
import { useRound } from '@/features/rounds/api/get-round';

/** Egg sacs, slings and the collection at a glance. */
export function BreedingRoute() {
  const { me, collection } = useShell();
  const navigate = useNavigate();
  const keeper = !!collection && collection.role !== 'helper';
  const collectionId = collection?.collectionId ?? '';
  const list = useAnimalList(collectionId, keeper);
  const sacs = useEggSacs(collectionId);
  const { local } = useRound(me.user.id, collectionId, 'today');
  const change = useBreedingChanges(collectionId);
  const [incubation, setIncubation] = useState({ minDays: '42', maxDays: '56' });
  if (!collection || !keeper) return <Notice tone="info" title="Breeding records are kept by the collection’s keepers." />;
  if (list.isPending) return <Loading />;
  if (list.isError) return <Notice tone="error" title={list.error.message} />;
  const today = localDateOf(new Date(), collection.timeZone);
  // Only females of groups that have a sac, case or brood: never a male or an unsexed juvenile.
  const females = list.data.animals.filter((a) => a.status === 'active' && canBreed(a));
  return (
    <div className="flex flex-col gap-6">
      <h1 className="text-3xl font-extrabold">Breeding and insights</h1>
      <SacsManager collectionId={collection.collectionId} today={today} females={females} onSlings={(animalIds) => navigate('/labels', { state: { animalIds } })} />
      <form
        className="grid grid-cols-2 gap-2 rounded-2xl border-2 border-border p-3"
        onSubmit={(e) => {
          e.preventDefault();
          change.incubation.mutate({ minDays: Number(incubation.minDays), maxDays: Number(incubation.maxDays) });
        }}
      >
        <p className="col-span-2 font-extrabold">Usual incubation for new egg sacs</p>
        <p className="col-span-2 text-sm text-muted">Common practice is about 6–8 weeks from laying to pulling or hatching; it varies by species, so set what your species need. Egg cases (about 4–8 weeks) and broods (until they disperse) have their own windows, changed on each record.</p>
        <TextField label="Shortest (days)" inputMode="numeric" value={incubation.minDays} onChange={(e) => setIncubation((w) => ({ ...w, minDays: e.target.value }))} />
        <TextField label="Longest (days)" inputMode="numeric" value={incubation.maxDays} onChange={(e) => setIncubation((w) => ({ ...w, maxDays: e.target.value }))} />
        {change.incubation.isError && <Notice tone="error" title={change.incubation.error.message} />}
        {change.incubation.isSuccess && <Notice tone="ok" title="Saved for new sacs." />}
        <Button type="submit" variant="secondary" className="col-span-2" busy={change.incubation.isPending}>
          Save
        </Button>
      </form>
      <Insights animals={list.data.animals} round={local.data?.round.items ?? []} sacs={sacs.data?.sacs ?? []} today={today} />
    </div>
  );
}
