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

/** Where the collection's other work lives, one tap from its list. */
const TOOLS = [
  { to: '/labels', label: 'Print labels' },
  { to: '/breeding', label: 'Breeding' },
  { to: '/import', label: 'Import CSV' },
  { to: '/places', label: 'Places' },
] as const;

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
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h1 className="text-3xl font-extrabold">Animals</h1>
        <div className="flex flex-wrap items-center gap-2">
          <Link
            to="/animals/new"
            className={`${linkClass} border-primary bg-primary text-on-primary`}
          >
            Add animal
          </Link>
          {/* Wide screens have room for every link; a phone folds them into one menu. */}
          <nav aria-label="Collection tools" className="hidden gap-2 lg:flex">
            {TOOLS.map((t) => (
              <Link key={t.to} to={t.to} className={linkClass}>
                {t.label}
              </Link>
            ))}
          </nav>
          <details className="group relative lg:hidden">
            <summary
              className={`${linkClass} cursor-pointer list-none gap-2 [&::-webkit-details-marker]:hidden`}
            >
              <span>More</span>
              <span aria-hidden="true" className="transition-transform group-open:rotate-180">
                ▾
              </span>
            </summary>
            <nav
              aria-label="Collection tools"
              className="absolute right-0 z-30 mt-1 flex w-60 flex-col rounded-xl border-2 border-border bg-surface p-1 shadow-lg"
            >
              {TOOLS.map((t) => (
                <Link
                  key={t.to}
                  to={t.to}
                  className="flex min-h-target items-center rounded-lg px-3 text-lg font-bold hover:bg-bg"
                >
                  {t.label}
                </Link>
              ))}
            </nav>
          </details>
        </div>
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
