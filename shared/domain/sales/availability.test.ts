import { describe, expect, it } from 'vitest';
import { readRfc4180 } from '../../../tests/support/rfc4180';
import {
  AVAILABILITY_COLUMNS,
  availabilityCsv,
  groupStock,
  instarOf,
  publicRows,
  type StockAnimal,
} from './availability';

const sling = (over: Partial<StockAnimal> = {}): StockAnimal => ({
  scientificName: 'Hapalopus formosus',
  commonName: 'Colombian pumpkin patch',
  group: 'tarantula',
  lifeStage: 'sling',
  sex: 'unknown',
  sizeMm: 12,
  instar: 3,
  priceMinor: 2500,
  currency: 'CAD',
  listedPublicly: true,
  state: 'available',
  ...over,
});

describe('groupStock', () => {
  it('groups by species and stage, counting available and reserved apart', () => {
    const groups = groupStock([
      sling({ sizeMm: 10, instar: 2 }),
      sling({ sizeMm: 14, instar: 4, sex: 'female' }),
      sling({ state: 'reserved', sizeMm: 30, priceMinor: 1 }),
      sling({ sex: 'mature_male', lifeStage: 'adult', sizeMm: 60, instar: null }),
      sling({ scientificName: 'Caribena versicolor', commonName: null, lifeStage: 'juvenile' }),
    ]);
    expect(groups.map((g) => [g.scientificName, g.lifeStage, g.available, g.reserved])).toEqual([
      ['Caribena versicolor', 'juvenile', 1, 0],
      ['Hapalopus formosus', 'sling', 2, 1],
      ['Hapalopus formosus', 'adult', 1, 0],
    ]);
    const slings = groups[1]!;
    // The reserved sling's size and price describe nothing on offer any more.
    expect(slings.sizeMm).toEqual({ min: 10, max: 14 });
    expect(slings.instar).toEqual({ min: 2, max: 4 });
    expect(slings.price).toEqual({ currency: 'CAD', min: 2500, max: 2500 });
    expect(slings.sexes).toEqual({ female: 1, male: 0, unknown: 1 });
    expect(groups[2]!.sexes).toEqual({ female: 0, male: 1, unknown: 0 });
    expect(groups[2]!.instar).toBeNull();
  });

  it('gives no price range when a group is priced in two currencies', () => {
    const [g] = groupStock([sling(), sling({ currency: 'EUR', priceMinor: 1800 })]);
    expect(g!.price).toBeNull();
  });
});

describe('instarOf', () => {
  it('counts from the first instar only for the collection’s own young', () => {
    expect(instarOf(true, 0)).toBe(1);
    expect(instarOf(true, 3)).toBe(4);
    expect(instarOf(false, 3)).toBeNull();
  });
});

describe('publicRows', () => {
  it('shows only public, available animals and only the chosen columns', () => {
    const rows = publicRows(
      [
        sling(),
        sling({ sizeMm: 11, priceMinor: 3000 }),
        sling({ listedPublicly: false }),
        sling({ state: 'reserved' }),
        sling({ scientificName: 'Kochiana brunnipes', listedPublicly: false }),
      ],
      ['species', 'price', 'count'],
      { locale: 'en-CA' },
    );
    expect(rows).toEqual([{ species: 'Hapalopus formosus', price: '$25.00–$30.00', count: 2 }]);
  });

  it('words every column a keeper may choose', () => {
    const [row] = publicRows([sling({ sex: 'female' }), sling()], AVAILABILITY_COLUMNS, {
      plain: true,
    });
    expect(row).toEqual({
      species: 'Hapalopus formosus',
      commonName: 'Colombian pumpkin patch',
      stage: 'Sling',
      sex: '1 female · 1 unsexed',
      size: '12 mm leg span · instar 3',
      price: '25.00 CAD',
      count: 2,
    });
  });
});

describe('availabilityCsv', () => {
  it('is RFC 4180 (§2: CRLF, quoted commas and quotes) as a strict reader sees it', () => {
    const csv = availabilityCsv(
      [
        sling({ commonName: 'Pumpkin, "patch"' }),
        sling({ scientificName: 'Caribena versicolor', commonName: 'Antilles\npinktoe' }),
      ],
      ['commonName', 'species', 'count'],
    );
    expect(csv.split('\r\n')[0]).toBe('Species,Common name,Available');
    expect(readRfc4180(csv)).toEqual([
      ['Species', 'Common name', 'Available'],
      ['Caribena versicolor', 'Antilles\npinktoe', '1'],
      ['Hapalopus formosus', 'Pumpkin, "patch"', '1'],
    ]);
  });
});
