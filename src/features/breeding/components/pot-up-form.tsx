import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import {
  firstFreeRun,
  placeCode,
  placeTree,
  rackAndShelf,
  runPositions,
} from '#shared/domain/places';
import { slingsBody, type EggSacView } from '#shared/schemas/breeding';
import type { LocationWithCount } from '#shared/schemas/locations';
import {
  choiceProblems,
  NO_CHOICE,
  PlacePicker,
  type PlaceChoice,
} from '@/components/place-picker';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useBreedingChanges } from '../api/breeding-api';

/** The API's body with its two numbers as typed; the shelf comes from the place picker. */
const potUpForm = slingsBody.omit({ room: true, rack: true, shelf: true }).extend({
  count: z.string().transform(Number).pipe(slingsBody.shape.count),
  firstPosition: z.string().transform(Number).pipe(slingsBody.shape.firstPosition),
});
type Input = z.input<typeof potUpForm>;
type Output = z.output<typeof potUpForm>;

interface Props {
  sac: EggSacView;
  collectionId: string;
  /** "slings", "nymphs", "scorplings". */
  young: string;
  /** The collection's places in walk order, with who lives in each. */
  places: readonly LocationWithCount[];
  /** The new animals' ids, to print their labels. */
  onSlings: (animalIds: string[]) => void;
}

const spotsOn = (places: readonly LocationWithCount[], c: PlaceChoice) =>
  places.filter((l) => l.room === c.room && l.rack === c.rack && l.shelf === c.shelf);

/** The pots' spots with the animals already in them: what the keeper must agree to share. */
function takenInRun(
  places: readonly LocationWithCount[],
  c: PlaceChoice,
  first: number,
  n: number,
) {
  const shelf = spotsOn(places, c);
  if (!Number.isInteger(first) || !Number.isInteger(n) || n < 1 || n > 2000) return [];
  const run = new Set(
    runPositions(
      shelf.map((l) => l.position),
      first,
      n,
    ),
  );
  return shelf.filter((l) => run.has(l.position) && l.occupants.length > 0);
}

/**
 * One record per pot, numbered in order, with label codes in sequence: all at once or none. The
 * shelf is picked from the tree or named anew; the first free run of spots is offered, and
 * spots already taken are named before anything is created.
 */
export function PotUpForm({ sac, collectionId, young, places, onSlings }: Props) {
  const { slings } = useBreedingChanges(collectionId);
  const count = sac.slingCount ?? sac.eggsWithLegs ?? 24;
  const { register, handleSubmit, setError, setValue, watch, formState } = useForm<
    Input,
    unknown,
    Output
  >({
    resolver: zodResolver(potUpForm),
    defaultValues: { count: String(count), namePrefix: sac.femaleName, firstPosition: '1' },
  });
  const [shelf, setShelf] = useState<PlaceChoice>(() => {
    // The shelf with room for the whole clutch that comes first in the walk, if any.
    for (const room of placeTree(places))
      for (const rack of room.racks)
        for (const s of rack.shelves)
          if (s.spots.every((p) => p.occupants.length === 0))
            return { ...NO_CHOICE, room: s.room, rack: s.rack, shelf: s.shelf };
    return NO_CHOICE;
  });
  const [share, setShare] = useState(false);
  const [tried, setTried] = useState(false);
  const { problem, attempt } = useServerProblem(setError);
  const e = formState.errors;
  const n = Number(watch('count'));
  const first = Number(watch('firstPosition'));
  const taken = takenInRun(places, shelf, first, n);
  const missing = choiceProblems(shelf, 'shelf');
  const free = firstFreeRun(
    spotsOn(places, shelf)
      .filter((l) => l.occupants.length > 0)
      .map((l) => l.position),
    Number.isInteger(n) && n > 0 ? n : 1,
  );
  const positions =
    Number.isInteger(first) && Number.isInteger(n) && n > 0 && n <= 2000
      ? runPositions(
          spotsOn(places, shelf).map((l) => l.position),
          first,
          n,
        )
      : [];
  const span =
    shelf.shelf && positions.length
      ? `${placeCode({ ...shelf, position: positions[0]! })}${positions.length > 1 ? ` to ${placeCode({ ...shelf, position: positions.at(-1)! })}` : ''}`
      : null;

  const submit = (ev: React.FormEvent) => {
    setTried(true);
    return handleSubmit((body) => {
      if (Object.keys(missing).length || (taken.length && !share)) return;
      return attempt(async () => {
        const created = await slings.mutateAsync({
          sacId: sac.id,
          body: { ...body, room: shelf.room, rack: shelf.rack, shelf: shelf.shelf },
        });
        onSlings(created.animalIds);
      });
    })(ev);
  };
  return (
    <form
      aria-label={`Pot up ${young} from ${sac.clutch}`}
      className="flex flex-col gap-2"
      onSubmit={submit}
      noValidate
    >
      <div className="grid grid-cols-2 gap-2">
        <TextField
          label="How many"
          inputMode="numeric"
          error={e.count?.message}
          {...register('count')}
        />
        <TextField
          label="Names start with"
          error={e.namePrefix?.message}
          {...register('namePrefix')}
        />
      </div>
      <PlacePicker
        legend="Onto which shelf or tray"
        places={places}
        value={shelf}
        to="shelf"
        onChange={(c) => {
          setShelf(c);
          setShare(false);
          // Start at the shelf's first run of free spots.
          const busy = spotsOn(places, c)
            .filter((l) => l.occupants.length > 0)
            .map((l) => l.position);
          setValue(
            'firstPosition',
            String(firstFreeRun(busy, Number.isInteger(n) && n > 0 ? n : 1)),
          );
        }}
        errors={tried ? missing : {}}
      />
      <TextField
        label="First position"
        inputMode="numeric"
        hint={
          span
            ? `The pots go in ${span} on ${rackAndShelf(shelf)}.`
            : 'The pots are numbered along the shelf from here.'
        }
        error={e.firstPosition?.message}
        {...register('firstPosition')}
      />
      {taken.length > 0 && (
        <div className="flex flex-col gap-2 rounded-xl border-2 border-accent bg-surface p-3">
          <p className="font-bold text-accent">
            <span aria-hidden="true">! </span>
            {taken.length === 1
              ? 'One of these spots is'
              : `${taken.length} of these spots are`}{' '}
            taken:{' '}
            {taken
              .slice(0, 4)
              .map((l) => `${placeCode(l)} by ${l.occupants.map((o) => o.name).join(', ')}`)
              .join('; ')}
            {taken.length > 4 ? ` and ${taken.length - 4} more` : ''}.
          </p>
          {free !== first && (
            <Button
              variant="secondary"
              className="self-start"
              onClick={() => {
                setValue('firstPosition', String(free));
                setShare(false);
              }}
            >
              Start at {placeCode({ ...shelf, position: String(free) })} instead (all free)
            </Button>
          )}
          <label className="flex min-h-target cursor-pointer items-center gap-3 font-bold">
            <input
              type="checkbox"
              className="size-6 accent-[var(--c-primary)]"
              checked={share}
              onChange={(ev) => setShare(ev.target.checked)}
            />
            Share those spots anyway
          </label>
          {tried && !share && (
            <p className="text-sm font-bold text-danger">
              <span aria-hidden="true">⚠ </span>
              Start at a free spot, or tick to share.
            </p>
          )}
        </div>
      )}
      <p className="text-sm text-muted">
        One record per pot, numbered in order, codes in sequence, all at once or none. Then print
        their labels.
      </p>
      {problem && <Notice tone="error" title={problem} />}
      <Button type="submit" busy={formState.isSubmitting}>
        Create {watch('count')} {young}
      </Button>
    </form>
  );
}
