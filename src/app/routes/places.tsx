import { useShell } from '@/app/layout/use-shell';
import { Notice } from '@/components/ui/notice';
import { PlacesManager } from '@/features/animals/components/places-manager';
import { RoomTargets } from '@/features/climate/components/room-targets';

export function PlacesRoute() {
  const { collection } = useShell();
  if (!collection || collection.role === 'helper')
    return <Notice tone="info" title="Places are kept by the collection’s keepers." />;
  return (
    <div className="flex flex-col gap-3">
      <h1 className="text-3xl font-extrabold">Places</h1>
      <PlacesManager collectionId={collection.collectionId} />
      <section aria-labelledby="room-climate-heading" className="flex flex-col gap-2">
        <h2 id="room-climate-heading" className="text-2xl font-extrabold">
          Room climate
        </h2>
        <p>
          A target range per room, in your unit. Readings outside it show on Today and in the
          owners’ morning e-mail.
        </p>
        <RoomTargets collectionId={collection.collectionId} />
      </section>
    </div>
  );
}
