import { useState, type FormEvent, type ReactNode } from 'react';
import {
  placeCode,
  placeTree,
  rackName,
  reorderWalk,
  shelfName,
  takenBy,
  type RackNode,
  type ShelfNode,
  type TreeTarget,
} from '#shared/domain/places';
import type { LocationWithCount } from '#shared/schemas/locations';
import {
  choiceProblems,
  existingPlace,
  NO_CHOICE,
  PlacePicker,
  type PlaceChoice,
} from '@/components/place-picker';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { TextField } from '@/components/ui/text-field';
import { useLocationChanges, useLocations } from '../api/animal-records';
import { DragHandle, SortableList, type DragHandleProps } from './sortable';

type Place = LocationWithCount;
type Changes = ReturnType<typeof useLocationChanges>;

const count = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;
const animalsIn = (spots: readonly Place[]) => spots.reduce((n, s) => n + s.animals, 0);

/**
 * The places of a collection, room by room and rack by rack, in the order the keeper walks them.
 * Racks, shelves and spots are reordered by dragging their grip or with their earlier/later
 * buttons, renamed in place, and opened or folded one rack at a time.
 */
export function PlacesManager({ collectionId }: { collectionId: string }) {
  const places = useLocations(collectionId);
  const change = useLocationChanges(collectionId);
  const [open, setOpen] = useState<ReadonlySet<string>>(new Set());
  const [said, setSaid] = useState('');
  if (places.isPending) return <Loading label="Loading places…" />;
  if (places.isError) return <Notice tone="error" title={places.error.message} />;
  const walk = places.data.locations;
  const tree = placeTree(walk);
  const error = (change.reorder.error ?? change.remove.error)?.message;
  const toggle = (key: string) =>
    setOpen((s) => {
      const next = new Set(s);
      if (next.has(key)) next.delete(key);
      else next.add(key);
      return next;
    });
  const move = (target: TreeTarget, to: number, words: string) =>
    change.reorder.mutate(
      reorderWalk(walk, target, to).map((l) => l.id),
      { onSuccess: () => setSaid(words) },
    );

  return (
    <div className="flex flex-col gap-4">
      <AddPlace places={walk} change={change} onAdded={(words) => setSaid(words)} />
      <p className="text-muted">
        The round lists animals in this order. Drag a rack, shelf or spot by its grip (⠿), or move
        it with its ↑ and ↓ buttons, to match the way you walk.
      </p>
      <p role="status" className="sr-only">
        {said}
      </p>
      {error && <Notice tone="error" title={error} />}
      {!walk.length && <Notice tone="info" title="No places yet: add the first one above." />}
      {tree.map((room, ri) => (
        <section key={room.key} aria-label={room.room} className="flex flex-col gap-2">
          <GroupHeader
            title={<h2 className="text-2xl font-extrabold">{room.room}</h2>}
            name={room.room}
            what={room.room}
            index={ri}
            of={tree.length}
            busy={change.reorder.isPending}
            onMove={(to) => move({ level: 'room', key: room.key }, to, `${room.room} moved.`)}
            onRename={(to) =>
              change.renameGroup.mutateAsync({ level: 'room', room: room.room, to })
            }
          />
          <SortableList
            label={`Racks in ${room.room}`}
            items={room.racks}
            keyOf={(r) => r.key}
            className="flex flex-col gap-2"
            onMove={(from, to) =>
              move(
                { level: 'rack', key: room.racks[from]!.key },
                to,
                `${rackName(room.racks[from]!.rack)} moved.`,
              )
            }
          >
            {(rack, i, handle) => (
              <RackPanel
                rack={rack}
                index={i}
                of={room.racks.length}
                handle={handle}
                open={open}
                toggle={toggle}
                change={change}
                onMove={move}
              />
            )}
          </SortableList>
        </section>
      ))}
    </div>
  );
}

/** A new spot, picked down the tree with its room, rack and shelf existing or new. */
function AddPlace({
  places,
  change,
  onAdded,
}: {
  places: readonly Place[];
  change: Changes;
  onAdded: (words: string) => void;
}) {
  const [choice, setChoice] = useState<PlaceChoice>(NO_CHOICE);
  const [tried, setTried] = useState(false);
  const missing = choiceProblems(choice);
  const exists = !!existingPlace(places, choice);
  async function submit(e: FormEvent) {
    e.preventDefault();
    setTried(true);
    if (Object.keys(missing).length || exists) return;
    const made = await change.create.mutateAsync(choice).catch(() => null);
    if (!made) return;
    onAdded(`${placeCode(made)} added.`);
    // The next place is usually the next position on the same shelf.
    setChoice({ ...choice, position: '' });
    setTried(false);
  }
  return (
    <form className="flex flex-col gap-2" onSubmit={submit} noValidate>
      <PlacePicker
        legend="Add a place"
        places={places}
        value={choice}
        onChange={setChoice}
        errors={tried ? missing : {}}
      />
      {exists && (
        <Notice
          tone="info"
          title={`${placeCode(choice)} is there already: choose “＋ New position…” to add one.`}
        />
      )}
      {change.create.error && <Notice tone="error" title={change.create.error.message} />}
      <Button type="submit" busy={change.create.isPending}>
        Add place
      </Button>
    </form>
  );
}

function RackPanel({
  rack,
  index,
  of,
  handle,
  open,
  toggle,
  change,
  onMove,
}: {
  rack: RackNode<Place>;
  index: number;
  of: number;
  handle: DragHandleProps;
  open: ReadonlySet<string>;
  toggle: (key: string) => void;
  change: Changes;
  onMove: (target: TreeTarget, to: number, words: string) => void;
}) {
  const name = rackName(rack.rack);
  const spots = rack.shelves.flatMap((s) => s.spots);
  const id = `rack-${encodeURIComponent(rack.key)}`;
  const expanded = open.has(rack.key);
  return (
    <div className="flex flex-col gap-2 rounded-xl border-2 border-border bg-surface p-2">
      <GroupHeader
        handle={handle}
        title={
          <Toggle controls={id} expanded={expanded} onClick={() => toggle(rack.key)}>
            <span className="block text-xl font-extrabold">{name}</span>
            <span className="block text-sm text-muted">
              {count(rack.shelves.length, 'shelf', 'shelves')} · {count(spots.length, 'spot')} ·{' '}
              {count(animalsIn(spots), 'animal')}
            </span>
          </Toggle>
        }
        name={rack.rack}
        what={name}
        index={index}
        of={of}
        busy={change.reorder.isPending}
        onMove={(to) => onMove({ level: 'rack', key: rack.key }, to, `${name} moved.`)}
        onRename={(to) =>
          change.renameGroup.mutateAsync({ level: 'rack', room: rack.room, rack: rack.rack, to })
        }
      />
      {expanded && (
        <div id={id}>
          <SortableList
            label={`Shelves of ${name}`}
            items={rack.shelves}
            keyOf={(s) => s.key}
            className="flex flex-col gap-2"
            onMove={(from, to) =>
              onMove(
                { level: 'shelf', key: rack.shelves[from]!.key },
                to,
                `${shelfName(rack.shelves[from]!.shelf)} moved.`,
              )
            }
          >
            {(shelf, i, h) => (
              <ShelfPanel
                shelf={shelf}
                index={i}
                of={rack.shelves.length}
                handle={h}
                open={open}
                toggle={toggle}
                change={change}
                onMove={onMove}
              />
            )}
          </SortableList>
        </div>
      )}
    </div>
  );
}

function ShelfPanel({
  shelf,
  index,
  of,
  handle,
  open,
  toggle,
  change,
  onMove,
}: {
  shelf: ShelfNode<Place>;
  index: number;
  of: number;
  handle: DragHandleProps;
  open: ReadonlySet<string>;
  toggle: (key: string) => void;
  change: Changes;
  onMove: (target: TreeTarget, to: number, words: string) => void;
}) {
  const name = `${rackName(shelf.rack)} · ${shelfName(shelf.shelf)}`;
  const first = shelf.spots[0]!;
  const last = shelf.spots.at(-1)!;
  const id = `shelf-${encodeURIComponent(shelf.key)}`;
  const expanded = open.has(shelf.key);
  return (
    <div className="flex flex-col gap-2 rounded-xl border-2 border-border bg-bg p-2">
      <GroupHeader
        handle={handle}
        title={
          <Toggle controls={id} expanded={expanded} onClick={() => toggle(shelf.key)}>
            <span className="block text-lg font-extrabold">{shelfName(shelf.shelf)}</span>
            <span className="block text-sm text-muted">
              {placeCode(first)}
              {shelf.spots.length > 1 && ` to ${placeCode(last)}`} ·{' '}
              {count(animalsIn(shelf.spots), 'animal')}
            </span>
          </Toggle>
        }
        name={shelf.shelf}
        what={name}
        index={index}
        of={of}
        busy={change.reorder.isPending}
        onMove={(to) => onMove({ level: 'shelf', key: shelf.key }, to, `${name} moved.`)}
        onRename={(to) =>
          change.renameGroup.mutateAsync({
            level: 'shelf',
            room: shelf.room,
            rack: shelf.rack,
            shelf: shelf.shelf,
            to,
          })
        }
      />
      {expanded && (
        <div id={id}>
          <SortableList
            label={`Spots on ${name}`}
            items={shelf.spots}
            keyOf={(s) => s.id}
            className="flex flex-col gap-1"
            onMove={(from, to) =>
              onMove(
                { level: 'position', key: shelf.key, id: shelf.spots[from]!.id },
                to,
                `${placeCode(shelf.spots[from]!)} moved.`,
              )
            }
          >
            {(spot, i, h) => (
              <div className="rounded-xl border-2 border-border bg-surface p-2">
                <GroupHeader
                  handle={h}
                  title={
                    <span className="flex min-h-target flex-col justify-center">
                      <span className="font-mono text-lg font-bold">{placeCode(spot)}</span>
                      <span className="text-sm text-muted">
                        {takenBy(spot.occupants.map((o) => o.name)) ?? 'free'}
                      </span>
                    </span>
                  }
                  name={spot.position}
                  what={placeCode(spot)}
                  index={i}
                  of={shelf.spots.length}
                  busy={change.reorder.isPending}
                  onMove={(to) =>
                    onMove(
                      { level: 'position', key: shelf.key, id: spot.id },
                      to,
                      `${placeCode(spot)} moved.`,
                    )
                  }
                  onRename={(to) =>
                    change.renameSpot.mutateAsync({
                      id: spot.id,
                      room: spot.room,
                      rack: spot.rack,
                      shelf: spot.shelf,
                      position: to,
                    })
                  }
                  extra={
                    spot.animals === 0 ? (
                      <Button
                        variant="danger"
                        aria-label={`Remove ${placeCode(spot)}`}
                        onClick={() => change.remove.mutate(spot.id)}
                      >
                        Remove
                      </Button>
                    ) : null
                  }
                />
              </div>
            )}
          </SortableList>
        </div>
      )}
    </div>
  );
}

function Toggle({
  controls,
  expanded,
  onClick,
  children,
}: {
  controls: string;
  expanded: boolean;
  onClick: () => void;
  children: ReactNode;
}) {
  return (
    <button
      type="button"
      aria-expanded={expanded}
      aria-controls={controls}
      onClick={onClick}
      className="flex min-h-target w-full min-w-0 items-center gap-2 rounded-xl px-2 text-left"
    >
      <span aria-hidden="true" className="text-xl">
        {expanded ? '▾' : '▸'}
      </span>
      <span className="min-w-0 flex-1">{children}</span>
    </button>
  );
}

/**
 * A group's title with its grip, then Rename, Earlier and Later (the keyboard's way to reorder)
 * on their own line so they keep their size on a phone.
 */
function GroupHeader({
  handle,
  title,
  name,
  what,
  index,
  of,
  busy,
  onMove,
  onRename,
  extra,
}: {
  handle?: DragHandleProps;
  title: ReactNode;
  /** The name as stored, offered for editing. */
  name: string;
  /** The group as people read it: "Rack C". */
  what: string;
  index: number;
  of: number;
  busy: boolean;
  onMove: (to: number) => void;
  onRename: (to: string) => Promise<unknown>;
  extra?: ReactNode;
}) {
  const [renaming, setRenaming] = useState(false);
  const [value, setValue] = useState(name);
  const [problem, setProblem] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);
  async function save(e: FormEvent) {
    e.preventDefault();
    setSaving(true);
    setProblem(null);
    try {
      await onRename(value);
      setRenaming(false);
    } catch (err) {
      setProblem(err instanceof Error ? err.message : String(err));
    } finally {
      setSaving(false);
    }
  }
  return (
    <div className="flex flex-col gap-2">
      <div className="flex items-center gap-2">
        {handle && <DragHandle handle={handle} what={what} />}
        <div className="min-w-0 flex-1">{title}</div>
      </div>
      {renaming ? (
        <form onSubmit={save} className="flex flex-col gap-2" aria-label={`Rename ${what}`}>
          <TextField
            label={`New name for ${what}`}
            value={value}
            autoFocus
            error={problem ?? undefined}
            onChange={(e) => setValue(e.target.value)}
          />
          <div className="flex flex-wrap gap-2">
            <Button type="submit" busy={saving}>
              Save name
            </Button>
            <Button variant="secondary" onClick={() => setRenaming(false)}>
              Cancel
            </Button>
          </div>
        </form>
      ) : (
        <div className="flex flex-wrap gap-2">
          <Button
            variant="secondary"
            aria-label={`Rename ${what}`}
            onClick={() => {
              setValue(name);
              setRenaming(true);
            }}
          >
            Rename
          </Button>
          {of > 1 && (
            <>
              <Button
                variant="secondary"
                aria-label={`Earlier in the walk: ${what}`}
                title="Earlier in the walk"
                disabled={index === 0 || busy}
                onClick={() => onMove(index - 1)}
              >
                <span aria-hidden="true">↑</span>
              </Button>
              <Button
                variant="secondary"
                aria-label={`Later in the walk: ${what}`}
                title="Later in the walk"
                disabled={index === of - 1 || busy}
                onClick={() => onMove(index + 1)}
              >
                <span aria-hidden="true">↓</span>
              </Button>
            </>
          )}
          {extra}
        </div>
      )}
    </div>
  );
}
