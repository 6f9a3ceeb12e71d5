import { Notice } from '@/components/ui/notice';
import { AnimalList } from '@/features/animals/components/animal-list';
import { useShell } from './shell';

export function AnimalsRoute() {
  const { collection } = useShell();
  if (!collection) return <Notice tone="info" title="You are not in any collection yet." />;
  return (
    <div className="flex flex-col gap-3">
      <h1 className="text-3xl font-extrabold">Animals</h1>
      <AnimalList collectionId={collection.collectionId} searchable />
    </div>
  );
}
