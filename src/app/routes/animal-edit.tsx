import { useMemo } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import { useShell } from '@/app/layout/use-shell';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import {
  useLocationChanges,
  useLocations,
  useSaveAnimal,
} from '@/features/animals/api/animal-records';
import { useAnimalList } from '@/features/animals/api/list-animals';
import { AnimalForm } from '@/features/animals/components/animal-form';
import { useSizeUnit } from '@/lib/preferences';

/** /animals/new and /animals/:animalId/edit: the same form. */
export function AnimalEditRoute() {
  const { collection } = useShell();
  const { animalId } = useParams();
  const navigate = useNavigate();
  const collectionId = collection?.collectionId ?? '';
  const list = useAnimalList(collectionId);
  const places = useLocations(collectionId);
  const placeChanges = useLocationChanges(collectionId);
  const save = useSaveAnimal(collectionId, animalId);
  const [unit] = useSizeUnit();
  const knownNames = useMemo(
    () => [...new Set(list.data?.animals.map((a) => a.scientificName) ?? [])].sort(),
    [list.data],
  );
  if (!collection || collection.role === 'helper')
    return <Notice tone="info" title="The collection’s records are kept by its keepers." />;
  if (list.isPending || places.isPending) return <Loading />;
  if (list.isError) return <Notice tone="error" title={list.error.message} />;
  const animal = animalId ? (list.data.animals.find((a) => a.id === animalId) ?? null) : null;
  if (animalId && !animal) return <Notice tone="error" title="We could not find that animal." />;
  return (
    <div className="flex flex-col gap-3">
      <h1 className="text-3xl font-extrabold">
        {animal ? `Edit ${animal.name}` : 'Add an animal'}
      </h1>
      <AnimalForm
        animal={animal}
        locations={places.data?.locations ?? []}
        onCreatePlace={(p) => placeChanges.create.mutateAsync(p).then((l) => l.id)}
        knownNames={knownNames}
        unit={unit}
        onSave={async (values) => {
          const saved = await save.mutateAsync(values);
          navigate(`/animals/${saved.id}`, { replace: true });
        }}
        onCancel={() => navigate(-1)}
      />
    </div>
  );
}
