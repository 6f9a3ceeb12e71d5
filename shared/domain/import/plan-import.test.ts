import { describe, expect, it } from 'vitest';
import { KEEPERS_SHEET } from '../../../tests/fixtures/keepers-sheet';
import { readCsv } from '../csv/csv-file';
import { firstSettings, planImport, questionsFor, type ImportSettings } from './plan-import';

describe('a keeper’s own spreadsheet', () => {
  // RFC 4180 § 2.5 says a field not enclosed in double quotes may not contain one; `4"` (four
  // inches) typed by hand breaks that rule, and is read as the text it plainly is.
  it('is read cell by cell, the inch mark included', () => {
    const table = readCsv(KEEPERS_SHEET);
    expect(table.headers).toEqual(['Name', 'Species', 'Sex', 'Size', 'Acquired']);
    expect(table.records.map((r) => r.cells)).toEqual([
      ['Tilly', 'Grammostola pulchra', 'F', '5in', '03/04/2025'],
      ['Bram', 'Aphonopelma chalcodes', 'M', '4"', '2025-4-3'],
      ['Sprout', 'Caribena versicolor', 'unsexed', '2 cm', '2025-04-03'],
      ['Dot', 'Tliltocatl albopilosus', '?', '', ''],
    ]);
  });

  it('maps its columns, and asks only for the life stage and the date order', () => {
    const table = readCsv(KEEPERS_SHEET);
    const settings = firstSettings(table);
    expect(settings.mapping).toEqual(['name', 'scientific_name', 'sex', 'size_mm', 'acquired_on']);
    // Nothing in the file settles 03/04/2025, so no order is assumed.
    expect(settings.dateOrder).toBeNull();
    const questions = questionsFor(table, settings.mapping);
    expect(questions).toMatchObject({
      missing: [],
      doubled: [],
      withoutGroup: 0, // every genus is one we know
      withoutStage: 4,
      withoutSex: 0,
      bareSizes: 0,
      dates: {
        ambiguous: {
          line: 2,
          cell: '03/04/2025',
          readings: { 'day-first': '2025-04-03', 'month-first': '2025-03-04' },
        },
        only: { 'day-first': null, 'month-first': null },
      },
    });
  });

  it('explains each row that still needs a choice, in words', () => {
    const table = readCsv(KEEPERS_SHEET);
    const plan = planImport(table, firstSettings(table), []);
    expect(plan.ready).toHaveLength(0);
    expect(plan.problems.map((p) => [p.line, p.name, p.result.errors])).toEqual([
      [
        2,
        'Tilly',
        [
          'Life stage: none given. Choose one above for the rows that don’t say.',
          'Acquired on: “03/04/2025” could be day first or month first. Choose the date order above.',
        ],
      ],
      [3, 'Bram', ['Life stage: none given. Choose one above for the rows that don’t say.']],
      [4, 'Sprout', ['Life stage: none given. Choose one above for the rows that don’t say.']],
      [5, 'Dot', ['Life stage: none given. Choose one above for the rows that don’t say.']],
    ]);
  });

  it('imports all four rows once a stage and the date order are chosen', () => {
    const table = readCsv(KEEPERS_SHEET);
    const settings: ImportSettings = {
      ...firstSettings(table),
      defaults: { group: null, stage: 'juvenile', sex: 'unknown' },
      dateOrder: 'day-first',
    };
    const plan = planImport(table, settings, []);
    expect(plan.problems).toEqual([]);
    expect(
      plan.ready.map((r) => [
        r.name,
        r.scientificName,
        r.group,
        r.lifeStage,
        r.sex,
        r.sizeMm,
        r.acquiredOn,
      ]),
    ).toEqual([
      ['Tilly', 'Grammostola pulchra', 'tarantula', 'juvenile', 'female', 127, '2025-04-03'],
      ['Bram', 'Aphonopelma chalcodes', 'tarantula', 'juvenile', 'male', 101.6, '2025-04-03'],
      ['Sprout', 'Caribena versicolor', 'tarantula', 'juvenile', 'unknown', 20, '2025-04-03'],
      ['Dot', 'Tliltocatl albopilosus', 'tarantula', 'juvenile', 'unknown', null, null],
    ]);
    // Month first reads Tilly's date the other way and nothing else changes.
    const monthFirst = planImport(table, { ...settings, dateOrder: 'month-first' }, []);
    expect(monthFirst.ready.map((r) => r.acquiredOn)).toEqual([
      '2025-03-04',
      '2025-04-03',
      '2025-04-03',
      null,
    ]);
  });
});

describe('choices for a whole file', () => {
  it('takes the date order the file’s own dates settle', () => {
    const table = readCsv(
      'Name,Species,Stage,Acquired\nA,Grammostola pulchra,sling,03/04/2025\nB,Grammostola pulchra,sling,25/12/2024\n',
    );
    const settings = firstSettings(table);
    expect(settings.dateOrder).toBe('day-first');
    expect(questionsFor(table, settings.mapping).dates.only['day-first']).toEqual({
      line: 3,
      cell: '25/12/2024',
    });
    expect(planImport(table, settings, []).ready.map((r) => r.acquiredOn)).toEqual([
      '2025-04-03',
      '2024-12-25',
    ]);
  });

  it('reads bare sizes in the unit the header names, else the keeper’s unit', () => {
    const inches = readCsv('Name,Species,Stage,DLS (in)\nA,Grammostola pulchra,adult,5\n');
    expect(firstSettings(inches).sizeUnit).toBe('in');
    expect(planImport(inches, firstSettings(inches), []).ready[0]!.sizeMm).toBe(127);
    const plain = readCsv('Name,Species,Stage,Size\nA,Grammostola pulchra,adult,5\n');
    expect(firstSettings(plain, 'in').sizeUnit).toBe('in');
    expect(firstSettings(plain).sizeUnit).toBe('mm');
    expect(questionsFor(plain, firstSettings(plain).mapping).bareSizes).toBe(1);
  });

  it('uses the defaults for rows that do not say, and a genus before the default group', () => {
    const table = readCsv(
      'Name,Species,Group,Sex\nA,Arion ater,,\nB,Hierodula membranacea,,\nC,Arion ater,beetle,F\n',
    );
    const settings = firstSettings(table);
    expect(questionsFor(table, settings.mapping)).toMatchObject({ withoutGroup: 1, withoutSex: 2 });
    const plan = planImport(
      table,
      { ...settings, defaults: { group: 'other', stage: 'adult', sex: 'female' } },
      [],
    );
    expect(plan.ready.map((r) => [r.name, r.group, r.sex])).toEqual([
      ['A', 'other', 'female'],
      ['B', 'mantis', 'female'],
      ['C', 'beetle', 'female'],
    ]);
    const none = planImport(
      table,
      { ...settings, defaults: { group: null, stage: 'adult', sex: 'unknown' } },
      [],
    );
    expect(none.problems.map((p) => p.result.errors)).toEqual([
      [
        'Group: none given, and “Arion” is not a genus we know. Choose a group above for the rows that don’t say.',
      ],
    ]);
  });

  it('says what is missing or doubled in the columns, and refuses codes already used', () => {
    const table = readCsv('Label,Name,Size,DLS\nNL-7K3,A,4in,5in\nNL-7K3,B,1in,2in\n');
    const settings = firstSettings(table);
    // "DLS" would also go to Size; the first guess leaves it out.
    expect(settings.mapping).toEqual(['code', 'name', 'size_mm', null]);
    const doubled = questionsFor(table, ['code', 'name', 'size_mm', 'size_mm']);
    expect(doubled.doubled).toEqual(['size_mm']);
    expect(doubled.missing).toEqual(['scientific_name']);
    const full = readCsv(
      'Code,Name,Species,Stage\nNL-7K3,A,Grammostola pulchra,adult\nnl-7k3,B,Grammostola pulchra,adult\nNL-4PQ,C,Grammostola pulchra,adult\n',
    );
    const plan = planImport(full, firstSettings(full), ['NL-4PQ']);
    expect(plan.ready.map((r) => r.name)).toEqual(['A']);
    expect(plan.problems.map((p) => p.result.errors[0])).toEqual([
      'Label code: NL-7K3 is already used by an earlier row.',
      'Label code: NL-4PQ is already used in this collection.',
    ]);
  });
});
