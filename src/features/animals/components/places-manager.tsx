import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import {
  locationInput,
  type LocationInput,
  type LocationWithCount,
} from '#shared/schemas/locations';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useLocationChanges, useLocations } from '../api/animal-records';

/** Rooms, racks, shelves and positions, in the order the keeper walks them. */
export function PlacesManager({ collectionId }: { collectionId: string }) {
  const places = useLocations(collectionId);
  const change = useLocationChanges(collectionId);
  const { register, handleSubmit, setError, setValue, formState } = useForm<LocationInput>({
    resolver: zodResolver(locationInput),
    defaultValues: { room: '', rack: '', shelf: '', position: '' },
  });
  const { problem, attempt } = useServerProblem(setError);
  const error = problem ?? (change.reorder.error ?? change.remove.error)?.message;
  if (places.isPending) return <Loading label="Loading places…" />;
  if (places.isError) return <Notice tone="error" title={places.error.message} />;
  const list = places.data.locations;
  const move = (i: number, by: number) => {
    const ids = list.map((l) => l.id);
    [ids[i], ids[i + by]] = [ids[i + by]!, ids[i]!];
    change.reorder.mutate(ids);
  };
  const label = (l: LocationWithCount) => `${l.room} · Rack ${l.rack} · ${l.shelf} · ${l.position}`;

  return (
    <div className="flex flex-col gap-4">
      {error && <Notice tone="error" title={error} />}
      <form
        className="grid grid-cols-2 gap-2 rounded-2xl border-2 border-border p-3"
        onSubmit={handleSubmit((place) =>
          attempt(async () => {
            await change.create.mutateAsync(place);
            // The next place is usually the next position on the same shelf.
            setValue('position', '');
          }),
        )}
      >
        <p className="col-span-2 font-extrabold">Add a place</p>
        {(['room', 'rack', 'shelf', 'position'] as const).map((k) => (
          <TextField
            key={k}
            label={{ room: 'Room', rack: 'Rack', shelf: 'Shelf or tray', position: 'Position' }[k]}
            error={formState.errors[k]?.message}
            {...register(k)}
          />
        ))}
        <Button type="submit" className="col-span-2" busy={formState.isSubmitting}>
          Add place
        </Button>
      </form>
      <p className="text-muted">
        The round lists animals in this order. Move a place up or down to match the way you walk.
      </p>
      <ol aria-label="Places in walk order" className="flex flex-col gap-1">
        {list.map((l, i) => (
          <li
            key={l.id}
            className="flex items-center gap-2 rounded-xl border-2 border-border bg-surface p-2"
          >
            <span className="min-w-0 flex-1">
              <span className="font-bold">{label(l)}</span>
              <span className="block text-sm text-muted">
                {l.animals === 1 ? '1 animal' : `${l.animals} animals`}
              </span>
            </span>
            <Button
              variant="secondary"
              aria-label={`Earlier in the walk: ${label(l)}`}
              disabled={i === 0 || change.reorder.isPending}
              onClick={() => move(i, -1)}
            >
              ↑
            </Button>
            <Button
              variant="secondary"
              aria-label={`Later in the walk: ${label(l)}`}
              disabled={i === list.length - 1 || change.reorder.isPending}
              onClick={() => move(i, 1)}
            >
              ↓
            </Button>
            {l.animals === 0 && (
              <Button
                variant="danger"
                aria-label={`Remove ${label(l)}`}
                onClick={() => change.remove.mutate(l.id)}
              >
                ✕
              </Button>
            )}
          </li>
        ))}
      </ol>
    </div>
  );
}
