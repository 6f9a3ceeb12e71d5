import { useParams } from 'react-router-dom';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { useAnimalList } from '@/features/animals/api/list-animals';
import { AnimalCard } from '@/features/animals/components/animal-card';
import { AnimalHistory } from '@/features/rounds/components/animal-history';
import { CareForm } from '@/features/rounds/components/care-form';
import { SchedulePanel } from '@/features/rounds/components/schedule-panel';
import { useShell } from './shell';

export function AnimalRoute() {
  const { me, collection } = useShell();
  const { animalId = '' } = useParams();
  const list = useAnimalList(collection?.collectionId ?? '');
  if (!collection) return <Notice tone="info" title="You are not in any collection yet." />;
  if (list.isPending) return <Loading />;
  if (list.isError) return <Notice tone="error" title={list.error.message} />;
  const animal = list.data.animals.find((a) => a.id === animalId);
  if (!animal) return <Notice tone="error" title="We could not find that animal." />;
  return (
    <div className="flex flex-col gap-4">
      <h1 className="sr-only">{animal.name}</h1>
      <AnimalCard animal={animal} />
      <SchedulePanel collectionId={collection.collectionId} animalId={animal.id} />
      <CareForm key={animal.id} collectionId={collection.collectionId} animal={animal} />
      <AnimalHistory recorder={{ userId: me.user.id, byName: me.user.displayName, collectionId: collection.collectionId }} animal={animal} timeZone={collection.timeZone} />
    </div>
  );
}
