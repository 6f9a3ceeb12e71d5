import { useQueryClient } from '@tanstack/react-query';
import { useParams } from 'react-router-dom';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { animalKeys, useAnimalList } from '@/features/animals/api/list-animals';
import { AnimalCard } from '@/features/animals/components/animal-card';
import { LabelPanel } from '@/features/labels/components/label-panel';
import { roundKeys } from '@/features/rounds/api/keys';
import { AnimalHistory } from '@/features/rounds/components/animal-history';
import { CareForm } from '@/features/rounds/components/care-form';
import { SchedulePanel } from '@/features/rounds/components/schedule-panel';
import { useShell } from './shell';

export function AnimalRoute() {
  const { me, collection } = useShell();
  const { animalId = '' } = useParams();
  const list = useAnimalList(collection?.collectionId ?? '');
  const queryClient = useQueryClient();
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
      <LabelPanel
        collectionId={collection.collectionId}
        animal={animal}
        onRelabelled={() => {
          void queryClient.invalidateQueries({ queryKey: animalKeys.all(collection.collectionId) });
          void queryClient.invalidateQueries({ queryKey: roundKeys.all(collection.collectionId) });
        }}
      />
      <CareForm key={animal.id} collectionId={collection.collectionId} animal={animal} />
      <AnimalHistory recorder={{ userId: me.user.id, byName: me.user.displayName, collectionId: collection.collectionId }} animal={animal} timeZone={collection.timeZone} />
    </div>
  );
}
