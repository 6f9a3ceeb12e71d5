import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { STATUS_LABEL } from '#shared/domain/animal-facts';
import { formatLocalDate } from '#shared/domain/date-words';
import { localDateOf } from '#shared/domain/local-dates';
import { formatSize, type SizeUnit } from '#shared/domain/units';
import type { AnimalSummary } from '#shared/schemas/animals';
import { NoCollection } from '@/app/layout/no-collection';
import { useShell } from '@/app/layout/use-shell';
import { AnimalMolts } from '@/app/panels/animal-molts';
import { AnimalPairing } from '@/app/panels/animal-pairing';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import {
  useLocationChanges,
  useLocations,
  useMoveAnimals,
  useRetireAnimal,
} from '@/features/animals/api/animal-records';
import { useAnimalList } from '@/features/animals/api/list-animals';
import { AnimalCard } from '@/features/animals/components/animal-card';
import { MovePanel } from '@/features/animals/components/move-panel';
import { PhotoPanel } from '@/features/animals/components/photo-panel';
import { RetirePanel } from '@/features/animals/components/retire-panel';
import { GrowthPanel } from '@/features/breeding/components/growth-panel';
import { AnimalRoomClimate } from '@/features/climate/components/animal-room-climate';
import { LabelPanel } from '@/features/labels/components/label-panel';
import { ForSalePanel } from '@/features/listings/components/for-sale-panel';
import { useAnimalHistory } from '@/features/rounds/api/animal-history';
import { localRoundQueryOptions } from '@/features/rounds/api/get-round';
import { AnimalHistory } from '@/features/rounds/components/animal-history';
import { CareForm } from '@/features/rounds/components/care-form';
import { SchedulePanel } from '@/features/rounds/components/schedule-panel';
import { AnimalSoldLine } from '@/features/sales/components/animal-sold-line';
import { useSizeUnit, useTemperatureUnit } from '@/lib/preferences';
import { useSyncStatus } from '@/lib/sync-driver';

export function AnimalRoute() {
  const { me, collection } = useShell();
  const { animalId = '' } = useParams();
  const collectionId = collection?.collectionId ?? '';
  const list = useAnimalList(collectionId);
  const places = useLocations(collectionId);
  const placeChanges = useLocationChanges(collectionId);
  const move = useMoveAnimals(collectionId);
  const retire = useRetireAnimal(collectionId, animalId);
  const [unit] = useSizeUnit();
  const [temperatureUnit] = useTemperatureUnit();
  const history = useAnimalHistory(collectionId, animalId);
  const recorder = { userId: me.user.id, byName: me.user.displayName, collectionId };
  const [panel, setPanel] = useState<'move' | 'retire' | null>(null);
  const localToday = useQuery(localRoundQueryOptions(me.user.id, collectionId, 'today'));
  const sync = useSyncStatus();
  if (!collection) return <NoCollection />;
  if (list.isPending) return <Loading />;
  if (list.isError) return <Notice tone="error" title={list.error.message} />;
  const animal = list.data.animals.find((a) => a.id === animalId);
  if (!animal) return <Notice tone="error" title="We could not find that animal." />;
  const kept = animal.status === 'active';
  const measuresLegSpan = animal.group === 'tarantula' || animal.group === 'true_spider';
  const today = localDateOf(new Date(), collection.timeZone);
  const todayItem =
    localToday.data?.round.date === today
      ? localToday.data.round.items.find((i) => i.animal.id === animal.id)
      : undefined;
  return (
    <div className="flex flex-col gap-4">
      <AnimalCard animal={animal} heading="h1" />
      <p className="text-muted">
        {animal.commonName && `${animal.commonName} · `}
        {measuresLegSpan ? 'Leg span' : 'Body length'} {formatSize(animal.sizeMm, unit)}
        {animal.acquiredOn && ` · acquired ${formatLocalDate(animal.acquiredOn)}`}
        {animal.source && ` from ${animal.source}`}
        {animal.clutch && ` · clutch ${animal.clutch}`}
      </p>
      {enclosureCare(animal, unit) && <p className="text-muted">{enclosureCare(animal, unit)}</p>}
      {animal.photoVersion && <PhotoPanel collectionId={collectionId} animal={animal} canChange />}
      {animal.cautionNote && <Notice tone="warning" title={animal.cautionNote} />}
      {!kept && (
        <Notice
          tone="info"
          title={`${STATUS_LABEL[animal.status]}${animal.statusDate ? ` on ${formatLocalDate(animal.statusDate)}` : ''}: not on any round.`}
        />
      )}
      {/* Sales — S: who bought it, for owners and keepers only. */}
      {animal.status === 'sold' && collection.role !== 'helper' && (
        <AnimalSoldLine collectionId={collectionId} animalId={animal.id} />
      )}
      {animal.notes && <p className="whitespace-pre-line">{animal.notes}</p>}
      <nav aria-label="Quick actions" className="grid grid-cols-2 gap-2">
        <Link
          to={`/animals/${animal.id}/edit`}
          className="inline-flex min-h-target items-center justify-center rounded-xl border-2 border-primary bg-primary px-4 text-lg font-bold text-on-primary"
        >
          Edit
        </Link>
        <Button variant="secondary" onClick={() => setPanel(panel === 'move' ? null : 'move')}>
          Move…
        </Button>
        {kept ? (
          <Button
            variant="secondary"
            onClick={() => setPanel(panel === 'retire' ? null : 'retire')}
          >
            Retire…
          </Button>
        ) : (
          <Button variant="secondary" busy={retire.isPending} onClick={() => retire.mutate(null)}>
            Back in the collection
          </Button>
        )}
      </nav>
      {panel === 'move' && (
        <MovePanel
          what={animal.name}
          locations={places.data?.locations ?? []}
          current={animal.location?.id}
          moving={[animal.id]}
          onCreatePlace={(p) => placeChanges.create.mutateAsync(p).then((l) => l.id)}
          onMove={(locationId, rehoused) =>
            move
              .mutateAsync({ animalIds: [animal.id], locationId, rehoused })
              .then(() => setPanel((p) => (p === 'move' ? null : p)))
          }
          onCancel={() => setPanel(null)}
        />
      )}
      {panel === 'retire' && (
        <RetirePanel
          what={animal.name}
          today={today}
          onRetire={(body) =>
            retire.mutateAsync(body).then(() => setPanel((p) => (p === 'retire' ? null : p)))
          }
          onCancel={() => setPanel(null)}
        />
      )}
      {retire.isError && <Notice tone="error" title={retire.error.message} />}
      {!animal.photoVersion && <PhotoPanel collectionId={collectionId} animal={animal} canChange />}
      <SchedulePanel
        collectionId={collectionId}
        animalId={animal.id}
        item={todayItem}
        timeZone={collection.timeZone}
        waiting={sync.waiting > 0}
      />
      <LabelPanel collectionId={collectionId} labelTag={collection.labelTag} animal={animal} />
      {/* Sales — L: owners and keepers only; a helper never sees a price. */}
      {collection.role !== 'helper' && (
        <ForSalePanel collectionId={collectionId} animalId={animal.id} kept={kept} />
      )}
      <GrowthPanel
        events={history.data?.events ?? []}
        timeZone={collection.timeZone}
        unit={unit}
        measure={measuresLegSpan ? 'Leg span' : 'Body length'}
      />
      <AnimalMolts
        key={`molts-${animal.id}`}
        recorder={recorder}
        animal={animal}
        timeZone={collection.timeZone}
        unit={unit}
      />
      <AnimalPairing
        recorder={recorder}
        female={animal}
        animals={list.data.animals}
        timeZone={collection.timeZone}
      />
      <CareForm key={animal.id} collectionId={collectionId} animal={animal} />
      <AnimalHistory
        recorder={recorder}
        animal={animal}
        timeZone={collection.timeZone}
        room={
          <AnimalRoomClimate
            collectionId={collectionId}
            animalId={animal.id}
            unit={temperatureUnit}
          />
        }
      />
    </div>
  );
}

/**
 * The enclosure and the animal's own care intervals in one line (docs/care-rules.md § Enclosure
 * care): "Enclosure 200 × 150 mm, 300 mm high · mist every 3 days · spot-clean never".
 */
function enclosureCare(animal: AnimalSummary, unit: SizeUnit): string | null {
  const parts: string[] = [];
  const { enclosureLengthMm: l, enclosureWidthMm: w, enclosureHeightMm: h } = animal;
  if (l !== null && w !== null) {
    const side = (mm: number) => formatSize(mm, unit).replace(/ (mm|in)$/, '');
    parts.push(
      `Enclosure ${side(l)} × ${formatSize(w, unit)}${h !== null ? `, ${formatSize(h, unit)} high` : ''}`,
    );
  }
  const own = (what: string, days: number | null) => {
    if (days === null) return;
    parts.push(days === 0 ? `${what} never` : `${what} every ${days} day${days === 1 ? '' : 's'}`);
  };
  own('mist', animal.mistEveryDays);
  own('moisten substrate', animal.moistenEveryDays);
  own('spot-clean', animal.spotCleanEveryDays);
  return parts.length ? parts.join(' · ') : null;
}
