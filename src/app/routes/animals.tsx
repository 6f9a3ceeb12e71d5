import { useCallback, useMemo, useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { localDateOf } from '#shared/domain/local-dates';
import { NoCollection } from '@/app/layout/no-collection';
import { useShell } from '@/app/layout/use-shell';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import {
  useLocationChanges,
  useLocations,
  useMoveAnimals,
  useRetireAllAnimals,
} from '@/features/animals/api/animal-records';
import { useAnimalList } from '@/features/animals/api/list-animals';
import { AnimalTable } from '@/features/animals/components/animal-table';
import { MovePanel } from '@/features/animals/components/move-panel';
import { RetirePanel } from '@/features/animals/components/retire-panel';
import { useRound } from '@/features/rounds/api/get-round';
import { useSizeUnit } from '@/lib/preferences';

const linkClass =
  'inline-flex min-h-target items-center rounded-xl border-2 border-border px-4 text-lg font-bold';

export function AnimalsRoute() {
  const { me, collection } = useShell();
  if (!collection) return <NoCollection />;
  if (collection.role === 'helper')
    return (
      <Notice
        tone="info"
        title="The collection’s records are kept by its keepers. Your round is on Today."
      />
    );
  return (
    <Collection
      userId={me.user.id}
      collectionId={collection.collectionId}
      timeZone={collection.timeZone}
    />
  );
}

function Collection({
  userId,
  collectionId,
  timeZone,
}: {
  userId: string;
  collectionId: string;
  timeZone: string;
}) {
  const navigate = useNavigate();
  const list = useAnimalList(collectionId);
  const { local } = useRound(userId, collectionId, 'today');
  const places = useLocations(collectionId);
  const placeChanges = useLocationChanges(collectionId);
  const move = useMoveAnimals(collectionId);
  const retire = useRetireAllAnimals(collectionId);
  const [unit] = useSizeUnit();
  const [chosen, setChosen] = useState<string[]>([]);
  const [panel, setPanel] = useState<'move' | 'retire' | null>(null);
  const dueToday = useMemo(
    () => new Set(local.data?.round.items.map((i) => i.animal.id) ?? []),
    [local.data],
  );
  const onSelection = useCallback((ids: string[]) => setChosen(ids), []);
  const what = chosen.length === 1 ? '1 animal' : `${chosen.length} animals`;

  return (
    <div className="flex flex-col gap-3">
      <h1 className="text-3xl font-extrabold">Animals</h1>
      <div className="flex flex-wrap gap-2">
        <Link
          to="/animals/new"
          className={`${linkClass} border-primary bg-primary text-on-primary`}
        >
          Add animal
        </Link>
        <Link to="/places" className={linkClass}>
          Places
        </Link>
        <Link to="/import" className={linkClass}>
          Import CSV
        </Link>
        <Link to="/labels" className={linkClass}>
          Labels…
        </Link>
        <Link to="/breeding" className={linkClass}>
          Breeding
        </Link>
      </div>
      {chosen.length > 0 && (
        <section
          aria-label="Chosen animals"
          className="sticky top-0 z-10 flex flex-col gap-2 rounded-2xl border-2 border-text bg-bg p-2"
        >
          <p className="font-bold">{what} chosen</p>
          <div className="flex flex-wrap gap-2">
            <Button
              variant="secondary"
              onClick={() => navigate('/labels', { state: { animalIds: chosen } })}
            >
              Print labels
            </Button>
            <Button variant="secondary" onClick={() => setPanel('move')}>
              Move…
            </Button>
            <Button variant="secondary" onClick={() => setPanel('retire')}>
              Retire…
            </Button>
          </div>
          {panel === 'move' && (
            <MovePanel
              what={what}
              locations={places.data?.locations ?? []}
              moving={chosen}
              onCreatePlace={(p) => placeChanges.create.mutateAsync(p).then((l) => l.id)}
              onMove={(locationId, rehoused) =>
                move
                  .mutateAsync({ animalIds: chosen, locationId, rehoused })
                  .then(() => setPanel(null))
              }
              onCancel={() => setPanel(null)}
            />
          )}
          {panel === 'retire' && (
            <RetirePanel
              what={what}
              today={localDateOf(new Date(), timeZone)}
              onRetire={(body) =>
                retire.mutateAsync({ animalIds: chosen, body }).then(() => setPanel(null))
              }
              onCancel={() => setPanel(null)}
            />
          )}
        </section>
      )}
      {list.isPending && <Loading label="Loading animals…" />}
      {list.isError && <Notice tone="error" title={list.error.message} />}
      {list.data && (
        <AnimalTable
          animals={list.data.animals}
          dueToday={dueToday}
          unit={unit}
          timeZone={timeZone}
          onSelection={onSelection}
        />
      )}
    </div>
  );
}
