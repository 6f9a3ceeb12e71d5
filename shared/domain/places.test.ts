import { describe, expect, it } from 'vitest';
import {
  bareName,
  firstFreeRun,
  placeCode,
  placeName,
  placeShort,
  placeTree,
  rackAndShelf,
  rackName,
  reorderWalk,
  runPositions,
  shelfHeading,
  shelfName,
  spotChoice,
  takenBy,
  walkOfTree,
  walkWithNewPlaces,
} from './places';

const spot = (rack: string, shelf: string, position: string, room = 'Spare room') => ({
  id: `${room}/${rack}/${shelf}/${position}`,
  room,
  rack,
  shelf,
  position,
});
const codes = (list: { rack: string; shelf: string; position: string }[]) => list.map(placeCode);

describe('writing a place', () => {
  it('never doubles a word the keeper typed: "Rack C" and "Shelf 3" stay Rack C, Shelf 3', () => {
    expect(rackName('Rack C')).toBe('Rack C');
    expect(rackName('rack  C')).toBe('Rack C');
    expect(rackName('Rack Rack C')).toBe('Rack C');
    expect(shelfName('Shelf 3')).toBe('Shelf 3');
    expect(shelfName('SHELF: 3')).toBe('Shelf 3');
    expect(rackAndShelf({ rack: 'Rack C', shelf: 'Shelf 3' })).toBe('Rack C · Shelf 3');
    expect(rackAndShelf({ rack: 'C', shelf: '3' })).toBe('Rack C · Shelf 3');
  });

  it('writes the same spot the same way whether the words were typed or not', () => {
    const typed = { room: 'Spare room', rack: 'Rack C', shelf: 'Shelf 3', position: 'Position 4' };
    const bare = { room: 'Spare room', rack: 'C', shelf: '3', position: '4' };
    expect(placeCode(typed)).toBe('C3-4');
    expect(placeCode(bare)).toBe('C3-4');
    expect(placeName(typed)).toBe('Spare room · C3-4');
    expect(placeShort(typed)).toBe(placeShort(bare));
    expect(shelfHeading(typed)).toBe('Spare room · Rack C · Shelf 3');
  });

  it('keeps words that only start like the app’s own, and a part that is nothing but the word', () => {
    expect(bareName('rack', 'Racks left')).toBe('Racks left');
    expect(bareName('rack', 'Rack')).toBe('Rack');
    expect(bareName('shelf', 'Shelving top')).toBe('Shelving top');
    expect(bareName('room', 'Rack room')).toBe('Rack room');
    expect(bareName('position', 'spot 7')).toBe('7');
  });

  it('keeps trays as trays in words and leaves the word out of the code', () => {
    expect(shelfName('Tray 2')).toBe('Tray 2');
    expect(shelfName('tray 2')).toBe('Tray 2');
    expect(placeCode({ rack: 'C', shelf: 'Tray 2', position: '01' })).toBe('C2-01');
  });

  it('runs rack and shelf together only when the join cannot be misread', () => {
    expect(placeCode({ rack: 'A', shelf: '1', position: '2' })).toBe('A1-2');
    expect(placeCode({ rack: '2', shelf: 'B', position: '5' })).toBe('2B-5');
    expect(placeCode({ rack: '12', shelf: '3', position: '4' })).toBe('12-3-4');
    expect(placeCode({ rack: 'Left', shelf: 'Top', position: '2' })).toBe('Left-Top-2');
    expect(placeCode({ rack: 'Window', shelf: '1', position: '2' })).toBe('Window-1-2');
  });

  it('says who occupies a spot, or that it is free', () => {
    const p = spot('B', '2', '1');
    expect(takenBy([])).toBeNull();
    expect(spotChoice(p, ['Rosie'])).toBe('B2-1 · taken by Rosie');
    expect(spotChoice(p, ['Rosie', 'Kiki', 'Moss'])).toBe('B2-1 · taken by Rosie and 2 more');
    expect(spotChoice(p, [])).toBe('B2-1 · free');
    expect(placeName(null)).toBe('No place yet');
  });
});

describe('the tree of places', () => {
  const walk = [
    spot('A', '1', '1'),
    spot('A', '1', '2'),
    spot('A', '2', '1'),
    spot('B', '1', '1'),
    spot('A', '3', '1'), // the walk comes back to rack A
    spot('X', '1', '1', 'Hall'),
  ];

  it('groups room → rack → shelf where each group first comes in the walk', () => {
    const tree = placeTree(walk);
    expect(tree.map((r) => r.room)).toEqual(['Spare room', 'Hall']);
    expect(tree[0]!.racks.map((r) => r.rack)).toEqual(['A', 'B']);
    expect(tree[0]!.racks[0]!.shelves.map((s) => s.shelf)).toEqual(['1', '2', '3']);
    expect(codes(walkOfTree(tree))).toEqual(['A1-1', 'A1-2', 'A2-1', 'A3-1', 'B1-1', 'X1-1']);
  });

  it('reorders a shelf within its rack and carries its spots along', () => {
    const moved = reorderWalk(walk, { level: 'shelf', key: 'Spare room\u0000A\u00003' }, 0);
    expect(codes(moved)).toEqual(['A3-1', 'A1-1', 'A1-2', 'A2-1', 'B1-1', 'X1-1']);
  });

  it('reorders racks, rooms and spots', () => {
    expect(codes(reorderWalk(walk, { level: 'rack', key: 'Spare room\u0000B' }, 0))).toEqual([
      'B1-1',
      'A1-1',
      'A1-2',
      'A2-1',
      'A3-1',
      'X1-1',
    ]);
    expect(codes(reorderWalk(walk, { level: 'room', key: 'Hall' }, 0))[0]).toBe('X1-1');
    const s = 'Spare room\u0000A\u00001';
    expect(
      codes(reorderWalk(walk, { level: 'position', key: s, id: walk[1]!.id }, 0)).slice(0, 2),
    ).toEqual(['A1-2', 'A1-1']);
    // Out of range: clamped to the end of the siblings.
    expect(
      codes(reorderWalk(walk, { level: 'shelf', key: 'Spare room\u0000A\u00001' }, 99)).slice(0, 4),
    ).toEqual(['A2-1', 'A3-1', 'A1-1', 'A1-2']);
    // An unknown group leaves the walk alone (grouped).
    expect(codes(reorderWalk(walk, { level: 'rack', key: 'nope' }, 0))).toEqual(
      codes(walkOfTree(placeTree(walk))),
    );
  });

  it('puts new places beside their kin, not at the end of the walk', () => {
    const next = walkWithNewPlaces(walk, [
      spot('A', '1', '3'), // after A1-2 on its shelf
      spot('B', '2', '1'), // a new shelf: after rack B
      spot('C', '1', '1'), // a new rack: after the room's last place
      spot('Z', '1', '1', 'Loft'), // a new room: at the end
      spot('A', '2', '0'), // before A2-1
    ]);
    expect(codes(next)).toEqual([
      'A1-1',
      'A1-2',
      'A1-3',
      'A2-0',
      'A2-1',
      'B1-1',
      'B2-1',
      'A3-1',
      'C1-1',
      'X1-1',
      'Z1-1',
    ]);
  });

  it('orders positions naturally when inserting (2 before 10)', () => {
    const shelf = [spot('C', '1', '1'), spot('C', '1', '10')];
    expect(codes(walkWithNewPlaces(shelf, [spot('C', '1', '2')]))).toEqual([
      'C1-1',
      'C1-2',
      'C1-10',
    ]);
  });
});

describe('numbered runs of pots', () => {
  it('finds the first run of free numbered spots', () => {
    expect(firstFreeRun([], 12)).toBe(1);
    expect(firstFreeRun(['01', '02', '05'], 2)).toBe(3);
    expect(firstFreeRun(['01', '02', '05'], 3)).toBe(6);
    expect(firstFreeRun(['top', 'Position 1'], 1)).toBe(2);
  });

  it('uses the shelf’s own spot names, padded like the shelf', () => {
    expect(runPositions(['01', '02', '03'], 2, 3)).toEqual(['02', '03', '04']);
    expect(runPositions(['1', '2'], 2, 2)).toEqual(['2', '3']);
    expect(runPositions([], 9, 2)).toEqual(['9', '10']);
    expect(runPositions(['001'], 1, 2)).toEqual(['001', '002']);
  });
});
