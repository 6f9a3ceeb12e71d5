import { useShell } from '@/app/layout/use-shell';
import { Notice } from '@/components/ui/notice';
import { PlacesManager } from '@/features/animals/components/places-manager';

export function PlacesRoute() {
  const { collection } = useShell();
  if (!collection || collection.role === 'helper')
    return <Notice tone="info" title="Places are kept by the collection’s keepers." />;
  return (
    <div className="flex flex-col gap-3">
      <h1 className="text-3xl font-extrabold">Places</h1>
      <PlacesManager collectionId={collection.collectionId} />
    </div>
  );
}
