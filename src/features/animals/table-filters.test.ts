import { describe, expect, it } from 'vitest';
import { sampleAnimal } from '../../../tests/fixtures/sample-round';
import { filterAnimals, NO_FILTERS } from './table-filters';

const place = (rack: string) => ({
  id: rack,
  room: 'Spare room',
  rack,
  shelf: '1',
  position: '1',
  walkOrder: 0,
});
const animals = [
  sampleAnimal({
    id: 'a',
    name: 'Juniper',
    labelCode: 'NL-7K3',
    lifeStage: 'adult',
    location: place('A'),
    cautions: ['urticating_hairs'],
  }),
  sampleAnimal({
    id: 'b',
    name: 'Ember',
    labelCode: 'NL-QX4',
    lifeStage: 'juvenile',
    group: 'scorpion',
    scientificName: 'Heterometrus spinifer',
    commonName: 'Giant forest scorpion',
    location: place('B'),
    cautions: ['potent_venom'],
  }),
  sampleAnimal({
    id: 'c',
    name: 'Gone',
    labelCode: 'NL-RR9',
    status: 'sold',
    location: place('A'),
  }),
];
const ids = (list: { id: string }[]) => list.map((a) => a.id);

describe('the collection table’s filters', () => {
  it('shows kept animals by default and every status on request', () => {
    expect(ids(filterAnimals(animals, NO_FILTERS, new Set()))).toEqual(['a', 'b']);
    expect(ids(filterAnimals(animals, { ...NO_FILTERS, status: '' }, new Set()))).toEqual([
      'a',
      'b',
      'c',
    ]);
    expect(ids(filterAnimals(animals, { ...NO_FILTERS, status: 'sold' }, new Set()))).toEqual([
      'c',
    ]);
  });

  it('combines stage, group, rack, caution and due today', () => {
    expect(ids(filterAnimals(animals, { ...NO_FILTERS, stage: 'juvenile' }, new Set()))).toEqual([
      'b',
    ]);
    expect(
      ids(
        filterAnimals(
          animals,
          { ...NO_FILTERS, group: 'scorpion', caution: 'potent_venom' },
          new Set(),
        ),
      ),
    ).toEqual(['b']);
    expect(
      ids(filterAnimals(animals, { ...NO_FILTERS, rack: 'A', status: '' }, new Set())),
    ).toEqual(['a', 'c']);
    expect(ids(filterAnimals(animals, { ...NO_FILTERS, dueToday: true }, new Set(['b'])))).toEqual([
      'b',
    ]);
  });

  it('searches codes however typed, names, species and common names', () => {
    expect(ids(filterAnimals(animals, { ...NO_FILTERS, search: 'nl 7k' }, new Set()))).toEqual([
      'a',
    ]);
    expect(ids(filterAnimals(animals, { ...NO_FILTERS, search: 'FOREST' }, new Set()))).toEqual([
      'b',
    ]);
    expect(ids(filterAnimals(animals, { ...NO_FILTERS, search: 'spinif' }, new Set()))).toEqual([
      'b',
    ]);
  });
});
