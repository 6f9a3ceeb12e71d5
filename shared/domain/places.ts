import { naturalKey } from './walk-order';

/**
 * How a place is written, everywhere: screens, pickers, labels, CSV and the round's cards.
 *
 * A spot is written as its code, rack then shelf then "-" then position ("C1-04"), with the
 * room in front where the screen lists places of several rooms ("Spare room · C1-04"). A group
 * is written with its word: "Rack C", "Rack C · Shelf 1". A keeper who typed the word
 * themselves ("Rack C", "Shelf 3") gets it once, never twice.
 */
export interface PlaceParts {
  room: string;
  rack: string;
  shelf: string;
  position: string;
}
export type PlaceLevel = 'room' | 'rack' | 'shelf' | 'position';

// The words the app writes itself before each part. "Tray" is kept when stored (a keeper's
// trays are trays) but left out of the code.
const STORED_PREFIX: Record<Exclude<PlaceLevel, 'room'>, RegExp> = {
  rack: /^rack(?![a-z])[\s:#.-]*/i,
  shelf: /^shelf(?![a-z])[\s:#.-]*/i,
  position: /^(?:position|pos|spot|slot)(?![a-z])[\s:#.-]*/i,
};
const TRAY = /^tray(?![a-z])[\s:#.-]*/i;

function stripAll(value: string, prefix: RegExp): string {
  let out = value;
  for (;;) {
    const next = out.replace(prefix, '');
    // A rack called just "Rack" stays "Rack": there would be nothing left to show.
    if (next === out || !next.trim()) return out;
    out = next;
  }
}

/**
 * A part as a keeper typed it, without the word the app writes before it: "Rack C" → "C",
 * "shelf 3" → "3", "Position 04" → "04". Rooms are names and stay as typed.
 */
export function bareName(level: PlaceLevel, value: string): string {
  const v = value.trim().replace(/\s+/g, ' ');
  return level === 'room' ? v : stripAll(v, STORED_PREFIX[level]);
}

const capitalised = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
const codePart = (level: 'rack' | 'shelf' | 'position', v: string) => {
  const bare = bareName(level, v);
  return level === 'shelf' ? stripAll(bare, TRAY) : bare;
};

/** "Rack C", however the rack was typed. */
export function rackName(rack: string): string {
  return `Rack ${bareName('rack', rack)}`;
}

/** "Shelf 1", or "Tray 2" for a tray. */
export function shelfName(shelf: string): string {
  const bare = bareName('shelf', shelf);
  return TRAY.test(bare) ? capitalised(bare) : `Shelf ${bare}`;
}

/** "Rack C · Shelf 1": one shelf of one rack. */
export function rackAndShelf(p: Pick<PlaceParts, 'rack' | 'shelf'>): string {
  return `${rackName(p.rack)} · ${shelfName(p.shelf)}`;
}

/**
 * The spot's code: "C1-04". Rack and shelf run together when one ends in a letter and the other
 * starts with a digit (or the other way round) and both are short; otherwise a hyphen keeps
 * them apart ("12-3-4", "Left-Top-2").
 */
export function placeCode(p: Pick<PlaceParts, 'rack' | 'shelf' | 'position'>): string {
  const rack = codePart('rack', p.rack);
  const shelf = codePart('shelf', p.shelf);
  const position = codePart('position', p.position);
  const last = rack.at(-1) ?? '';
  const first = shelf.charAt(0);
  const kind = (c: string) => (/\d/.test(c) ? 'digit' : /\p{L}/u.test(c) ? 'letter' : 'other');
  const joins =
    rack.length <= 3 &&
    shelf.length <= 3 &&
    kind(last) !== 'other' &&
    kind(first) !== 'other' &&
    kind(last) !== kind(first);
  return `${rack}${joins ? '' : '-'}${shelf}-${position}`;
}

/** "Spare room · C1-04"; without a place, "No place yet". */
export function placeName(p: PlaceParts | null | undefined): string {
  return p ? `${p.room} · ${placeCode(p)}` : NO_PLACE;
}

/** A card's place: the code alone (the round lists rooms in its shelf headings). */
export function placeShort(p: PlaceParts | null | undefined): string {
  return p ? placeCode(p) : NO_PLACE;
}

/** "Spare room · Rack C · Shelf 1": a shelf heading on the round and in pickers. */
export function shelfHeading(p: Pick<PlaceParts, 'room' | 'rack' | 'shelf'> | null): string {
  return p ? `${p.room} · ${rackAndShelf(p)}` : 'Without a place';
}

export const NO_PLACE = 'No place yet';

/** Who lives in a spot, as a picker says it: "taken by Rosie", "taken by Rosie and 2 more". */
export function takenBy(names: readonly string[]): string | null {
  if (!names.length) return null;
  return `taken by ${names[0]}${names.length > 1 ? ` and ${names.length - 1} more` : ''}`;
}

/** A spot in a picker: "C1-04 · taken by Rosie" or "C1-04 · free". */
export function spotChoice(p: PlaceParts, occupants: readonly string[]): string {
  return `${placeCode(p)} · ${takenBy(occupants) ?? 'free'}`;
}

// ---------------------------------------------------------------------------------------------
// The tree: rooms → racks → shelves → spots, in the keeper's walk order.

export interface ShelfNode<P extends PlaceParts> {
  key: string;
  room: string;
  rack: string;
  shelf: string;
  spots: P[];
}
export interface RackNode<P extends PlaceParts> {
  key: string;
  room: string;
  rack: string;
  shelves: ShelfNode<P>[];
}
export interface RoomNode<P extends PlaceParts> {
  key: string;
  room: string;
  racks: RackNode<P>[];
}

export const roomKey = (p: Pick<PlaceParts, 'room'>) => p.room;
export const rackKey = (p: Pick<PlaceParts, 'room' | 'rack'>) => `${p.room}\u0000${p.rack}`;
export const shelfKey = (p: Pick<PlaceParts, 'room' | 'rack' | 'shelf'>) =>
  `${p.room}\u0000${p.rack}\u0000${p.shelf}`;

/**
 * Places grouped room → rack → shelf, each group where its first place comes in the walk: a walk
 * that goes back to a rack puts the later places with the rest of their rack.
 */
export function placeTree<P extends PlaceParts>(walk: readonly P[]): RoomNode<P>[] {
  const rooms = new Map<string, RoomNode<P>>();
  const racks = new Map<string, RackNode<P>>();
  const shelves = new Map<string, ShelfNode<P>>();
  for (const p of walk) {
    let room = rooms.get(roomKey(p));
    if (!room) rooms.set(roomKey(p), (room = { key: roomKey(p), room: p.room, racks: [] }));
    let rack = racks.get(rackKey(p));
    if (!rack) {
      rack = { key: rackKey(p), room: p.room, rack: p.rack, shelves: [] };
      racks.set(rack.key, rack);
      room.racks.push(rack);
    }
    let shelf = shelves.get(shelfKey(p));
    if (!shelf) {
      shelf = { key: shelfKey(p), room: p.room, rack: p.rack, shelf: p.shelf, spots: [] };
      shelves.set(shelf.key, shelf);
      rack.shelves.push(shelf);
    }
    shelf.spots.push(p);
  }
  return [...rooms.values()];
}

/** The walk the tree describes: room by room, rack by rack, shelf by shelf. */
export function walkOfTree<P extends PlaceParts>(tree: readonly RoomNode<P>[]): P[] {
  return tree.flatMap((r) => r.racks.flatMap((k) => k.shelves.flatMap((s) => s.spots)));
}

/** The list with one item moved from one index to another (both clamped to the list). */
export function moveItem<T>(list: readonly T[], from: number, to: number): T[] {
  const out = [...list];
  if (from < 0 || from >= out.length) return out;
  const [item] = out.splice(from, 1);
  out.splice(Math.max(0, Math.min(to, out.length)), 0, item!);
  return out;
}

/** Which list of siblings a node belongs to, by level and its key. */
export type TreeTarget =
  | { level: 'room'; key: string }
  | { level: 'rack'; key: string }
  | { level: 'shelf'; key: string }
  | { level: 'position'; key: string; id: string };

/**
 * The walk after one group (or spot) moved among its siblings to index `to`: what the places
 * editor sends as the new walk order. Unknown targets leave the walk as it was.
 */
export function reorderWalk<P extends PlaceParts & { id: string }>(
  walk: readonly P[],
  target: TreeTarget,
  to: number,
): P[] {
  const tree = placeTree(walk);
  const swap = <T>(list: T[], index: number) => moveItem(list, index, to);
  const next = tree.map((room) => ({ ...room, racks: room.racks.map((r) => ({ ...r })) }));
  if (target.level === 'room') {
    const i = next.findIndex((r) => r.key === target.key);
    return walkOfTree(i < 0 ? next : swap(next, i));
  }
  for (const room of next) {
    if (target.level === 'rack') {
      const i = room.racks.findIndex((r) => r.key === target.key);
      if (i >= 0) room.racks = swap(room.racks, i);
      continue;
    }
    for (const rack of room.racks) {
      if (target.level === 'shelf') {
        const i = rack.shelves.findIndex((s) => s.key === target.key);
        if (i >= 0) rack.shelves = swap(rack.shelves, i);
        continue;
      }
      rack.shelves = rack.shelves.map((s) => {
        if (s.key !== target.key) return s;
        const i = s.spots.findIndex((p) => p.id === target.id);
        return i < 0 ? s : { ...s, spots: swap(s.spots, i) };
      });
    }
  }
  return walkOfTree(next);
}

/**
 * The walk with new places put beside their kin: on a known shelf among its spots by position
 * (natural order), else after the last place of their rack, else of their room, else at the end.
 * New places come in the order given.
 */
export function walkWithNewPlaces<P extends PlaceParts, N extends PlaceParts>(
  walk: readonly P[],
  added: readonly N[],
): (P | N)[] {
  // Keys once per place: an import may add thousands of places to a walk of thousands.
  const keysOf = (p: PlaceParts) => ({
    room: p.room,
    rack: rackKey(p),
    shelf: shelfKey(p),
    position: naturalKey(p.position),
  });
  const out: (P | N)[] = [...walk];
  const keys = out.map(keysOf);
  const lastWhere = (ok: (k: ReturnType<typeof keysOf>) => boolean) => {
    for (let i = keys.length - 1; i >= 0; i--) if (ok(keys[i]!)) return i;
    return -1;
  };
  for (const n of added) {
    const k = keysOf(n);
    let at: number;
    const firstOnShelf = keys.findIndex((o) => o.shelf === k.shelf);
    if (firstOnShelf >= 0) {
      const before = lastWhere((o) => o.shelf === k.shelf && o.position <= k.position);
      at = before >= 0 ? before + 1 : firstOnShelf;
    } else {
      const onRack = lastWhere((o) => o.rack === k.rack);
      const inRoom = onRack >= 0 ? onRack : lastWhere((o) => o.room === k.room);
      at = inRoom >= 0 ? inRoom + 1 : out.length;
    }
    out.splice(at, 0, n);
    keys.splice(at, 0, k);
  }
  return out;
}

/**
 * The first position from which `count` numbered spots in a row are all free on a shelf whose
 * taken positions are given (1 when the shelf is empty). Positions that are not numbers are
 * ignored: they cannot clash with numbered pots.
 */
export function firstFreeRun(taken: Iterable<string>, count: number): number {
  const used = new Set<number>();
  for (const t of taken) {
    const n = Number(bareName('position', t));
    if (Number.isInteger(n) && n > 0) used.add(n);
  }
  let start = 1;
  for (;;) {
    let clash = -1;
    for (let i = 0; i < count; i++)
      if (used.has(start + i)) {
        clash = start + i;
        break;
      }
    if (clash < 0) return start;
    start = clash + 1;
  }
}

/**
 * The positions a numbered run of pots takes on a shelf: an existing spot's own name where its
 * number matches ("01" for 1 on a shelf written 01, 02 …), else the number written like the
 * shelf's other spots (zero-padded to their width when they are).
 */
export function runPositions(onShelf: readonly string[], first: number, count: number): string[] {
  const byNumber = new Map<number, string>();
  let padded = 0;
  for (const name of onShelf) {
    const bare = bareName('position', name);
    if (!/^\d+$/.test(bare)) continue;
    byNumber.set(Number(bare), name);
    if (bare.startsWith('0') && bare.length > 1) padded = Math.max(padded, bare.length);
  }
  return Array.from({ length: Math.max(0, count) }, (_, i) => {
    const n = first + i;
    return byNumber.get(n) ?? String(n).padStart(padded, '0');
  });
}
