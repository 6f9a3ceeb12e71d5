import { describe, expect, it } from 'vitest';
import { sampleAnimal } from '../../../tests/fixtures/sample-round';
import { NO_PICK, pickAnimals, pickChoices } from './choose-animals';

const place = (rack: string, shelf: string) => ({
  id: `${rack}${shelf}`,
  room: 'Spare room',
  rack,
  shelf,
  position: '1',
  walkOrder: 0,
});
const animals = [
  sampleAnimal({
    id: 'a',
    name: 'Juniper',
    labelCode: 'NL-7K3',
    location: place('A', '1'),
    addedAt: '2026-06-01T12:00:00Z',
  }),
  sampleAnimal({
    id: 'b',
    name: 'Formosus 01',
    labelCode: 'NL-QX4',
    location: place('C', '1'),
    clutch: 'H. formosus sac 1',
    addedAt: '2026-11-30T04:30:00Z',
  }),
  sampleAnimal({
    id: 'c',
    name: 'Formosus 13',
    labelCode: 'NL-RR9',
    location: place('C', '2'),
    clutch: 'H. formosus sac 1',
    addedAt: '2026-11-30T12:00:00Z',
  }),
  sampleAnimal({
    id: 'd',
    name: 'Old timer',
    labelCode: 'NL-ZZ2',
    location: place('A', '2'),
    status: 'deceased',
  }),
];
const ids = (list: { id: string }[]) => list.map((a) => a.id);
const zone = 'America/Toronto';

describe('choosing animals for labels', () => {
  it('filters by rack, shelf or tray, and clutch; leaves out animals no longer kept', () => {
    expect(ids(pickAnimals(animals, NO_PICK, zone))).toEqual(['a', 'b', 'c']);
    expect(ids(pickAnimals(animals, { ...NO_PICK, rack: 'C' }, zone))).toEqual(['b', 'c']);
    expect(ids(pickAnimals(animals, { ...NO_PICK, rack: 'C', shelf: '2' }, zone))).toEqual(['c']);
    expect(ids(pickAnimals(animals, { ...NO_PICK, clutch: 'H. formosus sac 1' }, zone))).toEqual([
      'b',
      'c',
    ]);
  });

  it('reads "added since" as a day in the collection’s zone', () => {
    // 04:30Z on 30 Nov is 23:30 on 29 Nov in Toronto (EST, UTC−5; IANA tz database).
    expect(ids(pickAnimals(animals, { ...NO_PICK, addedSince: '2026-11-30' }, zone))).toEqual([
      'c',
    ]);
    expect(ids(pickAnimals(animals, { ...NO_PICK, addedSince: '2026-11-29' }, zone))).toEqual([
      'b',
      'c',
    ]);
  });

  it('searches codes however typed, names and species', () => {
    expect(ids(pickAnimals(animals, { ...NO_PICK, search: ' nl 7k3' }, zone))).toEqual(['a']);
    expect(ids(pickAnimals(animals, { ...NO_PICK, search: 'formosus 1' }, zone))).toEqual(['c']);
  });

  it('offers the racks, shelves and clutches there are', () => {
    expect(pickChoices(animals, '')).toEqual({
      racks: ['A', 'C'],
      shelves: ['1', '2'],
      clutches: ['H. formosus sac 1'],
    });
    expect(pickChoices(animals, 'C').shelves).toEqual(['1', '2']);
  });
});
