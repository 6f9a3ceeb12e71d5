import { describe, expect, it } from 'vitest';
import { sampleAnimal } from '../../../tests/fixtures/sample-round';
import { ANIMAL_COLUMNS, animalToRow, guessColumn, rowToAnimal } from './animal-columns';
import { readCsv, writeCsv } from './csv-file';

const place = {
  id: 'l1',
  room: 'Spare room, north wall',
  rack: 'A',
  shelf: '1',
  position: '2',
  walkOrder: 1,
};

describe('the animal spreadsheet', () => {
  it('round-trips an animal through CSV with commas, quotes, line breaks and non-ASCII', () => {
    const animal = sampleAnimal({
      name: 'Señora "Juniper", 2nd',
      scientificName: 'Grammostola pulchra Mello-Leitão, 1921',
      commonName: 'Brazilian black',
      location: place,
      cautions: ['urticating_hairs', 'escape_risk'],
      cautionNote: 'Bolts up the lid',
      notes: 'Line one\r\nLine two, with a comma',
      sizeMm: 129.5,
      intervalDays: 12,
      preyType: 'roach',
      preySize: 'large',
      preyCount: 2,
      clutch: 'Sac 1',
      acquiredOn: '2025-03-01',
      source: 'Expo, Hamilton',
    });
    const csv = writeCsv(ANIMAL_COLUMNS, [animalToRow(animal)]);
    const table = readCsv(csv);
    const cells = Object.fromEntries(table.headers.map((h, i) => [h, table.records[0]!.cells[i]!]));
    const back = rowToAnimal(cells);
    expect(back).toMatchObject({
      ok: true,
      value: {
        labelCode: animal.labelCode,
        name: animal.name,
        scientificName: animal.scientificName,
        place: { room: place.room, rack: 'A', shelf: '1', position: '2' },
        cautions: ['urticating_hairs', 'escape_risk'],
        notes: animal.notes,
        sizeMm: 129.5,
        care: {
          intervalDays: 12,
          preyType: 'roach',
          preySize: 'large',
          preyCount: 2,
          hasWaterDish: true,
          doNotFeedUntil: null,
        },
      },
    });
  });

  it('matches the headers people write', () => {
    expect(guessColumn('Scientific name')).toBe('scientific_name');
    expect(guessColumn('Species')).toBe('scientific_name');
    expect(guessColumn('Size (mm)')).toBe('size_mm');
    expect(guessColumn('Label')).toBe('code');
    expect(guessColumn('Tray')).toBe('shelf');
    expect(guessColumn('Favourite colour')).toBeNull();
    expect(guessColumn('DLS inches')).toBe('size_mm');
    expect(guessColumn('Gender')).toBe('sex');
    expect(guessColumn('Date acquired')).toBe('acquired_on');
    // The import screen's own names for our columns are read back too.
    expect(guessColumn('Species (scientific name)')).toBe('scientific_name');
    expect(guessColumn('Feed every (days)')).toBe('interval_days');
  });

  it('names the column of each problem in a row, in plain words, all at once', () => {
    const bad = rowToAnimal({
      name: '',
      scientific_name: 'monocentropus balfouri',
      group: 'fish',
      stage: 'adult',
      size_mm: 'big',
      cautions: 'bites',
    });
    expect(bad).toEqual({
      ok: false,
      errors: [
        'Name: Give the animal a name or a short tag.',
        'Species (scientific name): The genus (and a subgenus) starts with a capital letter, the rest in lower case (ICZN Art. 28). Did you mean “Monocentropus balfouri”?',
        'Group: “fish” is not a group we know: use Tarantula, True spider, Centipede, Scorpion, Mantis, Beetle, Other.',
        'Size: “big” is not a size we can read: write it like 45 mm, 4.5 cm or 2in.',
        'Cautions: “bites” is not a caution we know: use potent venom, urticating hairs, fast or defensive, escape risk, sting.',
      ],
    });
  });

  it('reads cautions by their labels too, each once', () => {
    const row = rowToAnimal({
      name: 'Pokey',
      scientific_name: 'Omothymus schioedtei',
      stage: 'adult',
      cautions: 'Fast or defensive; potent venom, fast_defensive',
    });
    expect(row.ok && row.value.cautions).toEqual(['fast_defensive', 'potent_venom']);
    expect(row.ok && row.value.group).toBe('tarantula');
  });

  it('refuses a stage the group does not have, and reads a diet (docs/care-rules.md § Stages, § Diets)', () => {
    const larva = rowToAnimal({
      name: 'Mantra',
      scientific_name: 'Hierodula membranacea',
      group: 'mantis',
      stage: 'larva',
    });
    expect(larva).toEqual({
      ok: false,
      errors: [
        'Life stage: Mantis: there is no “Larva” stage. Choose Nymph L1–L3, Nymph L4+, Subadult or Adult.',
      ],
    });
    const slug = rowToAnimal({
      name: 'Slug',
      scientific_name: 'Arion ater',
      group: 'other',
      stage: 'adult',
      diet: 'Plant',
    });
    expect(slug.ok && slug.value.care.diet).toBe('plant');
    expect(
      rowToAnimal({
        name: 'Slug',
        scientific_name: 'Arion ater',
        group: 'other',
        stage: 'adult',
        diet: 'fruit jelly',
      }),
    ).toMatchObject({ ok: true });
  });
});
