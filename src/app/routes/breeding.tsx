import { useNavigate } from 'react-router-dom';
import { canBreed } from '#shared/domain/breeding';
import { localDateOf } from '#shared/domain/local-dates';
import { useShell } from '@/app/layout/use-shell';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { useLocations } from '@/features/animals/api/animal-records';
import { useAnimalList } from '@/features/animals/api/list-animals';
import { useEggSacs } from '@/features/breeding/api/breeding-api';
import { IncubationForm } from '@/features/breeding/components/incubation-form';
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
  const places = useLocations(collectionId, keeper);
  const { local } = useRound(me.user.id, collectionId, 'today');
  if (!collection || !keeper)
    return <Notice tone="info" title="Breeding records are kept by the collection’s keepers." />;
  if (list.isPending) return <Loading />;
  if (list.isError) return <Notice tone="error" title={list.error.message} />;
  const today = localDateOf(new Date(), collection.timeZone);
  // Only females of groups that have a sac, case or brood: never a male or an unsexed juvenile.
  const females = list.data.animals.filter((a) => a.status === 'active' && canBreed(a));
  return (
    <div className="flex flex-col gap-6">
      <h1 className="text-3xl font-extrabold">Breeding and insights</h1>
      <SacsManager
        collectionId={collection.collectionId}
        today={today}
        females={females}
        places={places.data?.locations ?? []}
        onSlings={(animalIds) => navigate('/labels', { state: { animalIds } })}
      />
      <IncubationForm collectionId={collection.collectionId} />
      <Insights
        animals={list.data.animals}
        round={local.data?.round.items ?? []}
        sacs={sacs.data?.sacs ?? []}
        today={today}
      />
    </div>
  );
}
