import { describe, expect, it } from 'vitest';
import {
  genusGroup,
  readDate,
  readGroup,
  readSex,
  readSize,
  readStage,
  unitInHeader,
  type CellRead,
} from './cell-readers';

const value = <T>(r: CellRead<T>) => (r.ok ? r.value : `problem: ${r.problem}`);

describe('reading a sex as keepers write it', () => {
  it.each([
    ['F', 'female'],
    ['f', 'female'],
    [' Female ', 'female'],
    ['♀', 'female'],
    ['♀\uFE0F', 'female'],
    ['0.1', 'female'],
    ['M', 'male'],
    ['male', 'male'],
    ['♂', 'male'],
    ['1.0', 'male'],
    ['MM', 'mature_male'],
    ['Mature male', 'mature_male'],
    ['mature_male', 'mature_male'],
    ['unsexed', 'unknown'],
    ['Unknown', 'unknown'],
    ['?', 'unknown'],
    ['', 'unknown'],
    ['   ', 'unknown'],
    ['0.0.1', 'unknown'],
    ['F?', 'unknown'],
  ])('%j is %s', (cell, sex) => {
    expect(value(readSex(cell))).toBe(sex);
  });

  it('explains a sex it cannot read', () => {
    expect(readSex('girl')).toEqual({
      ok: false,
      problem: '“girl” is not a sex we know: write F, M, MM (mature male) or unsexed.',
    });
  });
});

// 1 in = 25.4 mm exactly: the international yard and pound agreement of 1959 (NIST SP 811,
// Appendix B.8). Sizes are kept to a tenth of a millimetre.
describe('reading a size in mm, cm or inches', () => {
  it.each([
    ['5in', 127],
    ['5 in', 127],
    ['5 inches', 127],
    ['4"', 101.6],
    ['4 ”', 101.6],
    ["3''", 76.2],
    ['2 1/2"', 63.5],
    ['½ in', 12.7],
    ['1.5in', 38.1],
    ['2 cm', 20],
    ['2,5 cm', 25],
    ['45mm', 45],
    ['45 mm DLS', 45],
    ['12.5 millimetres', 12.5],
    ['', null],
  ])('%j is %s mm', (cell, mm) => {
    expect(value(readSize(cell, 'mm'))).toBe(mm);
  });

  it('reads a bare number in the unit chosen for the file', () => {
    expect(value(readSize('45', 'mm'))).toBe(45);
    expect(value(readSize('4.5', 'cm'))).toBe(45);
    expect(value(readSize('3', 'in'))).toBe(76.2);
  });

  it('explains what it cannot read, and asks for one size instead of a range', () => {
    expect(value(readSize('big', 'mm'))).toBe(
      'problem: “big” is not a size we can read: write it like 45 mm, 4.5 cm or 2in.',
    );
    expect(value(readSize('4-5in', 'mm'))).toBe(
      'problem: “4-5in” is a range: give one size, such as the larger.',
    );
  });

  it('finds the unit a header names', () => {
    expect(unitInHeader('size_mm')).toBe('mm');
    expect(unitInHeader('Size (in)')).toBe('in');
    expect(unitInHeader('DLS inches')).toBe('in');
    expect(unitInHeader('Leg span, cm')).toBe('cm');
    expect(unitInHeader('Size')).toBeNull();
    expect(unitInHeader('Size in the tub')).toBeNull();
  });
});

describe('reading a date', () => {
  it.each([
    ['2025-04-03', '2025-04-03'],
    ['2025-4-3', '2025-04-03'],
    ['2025/4/3', '2025-04-03'],
    ['2025.04.03', '2025-04-03'],
    ['2025-04-03T10:15:00', '2025-04-03'],
    ['3 Apr 2025', '2025-04-03'],
    ['3-Apr-2025', '2025-04-03'],
    ['3rd April 2025', '2025-04-03'],
    ['April 3, 2025', '2025-04-03'],
    ['Sept 30 2025', '2025-09-30'],
    ['', null],
  ])('%j is %s whatever the order', (cell, date) => {
    expect(value(readDate(cell, null))).toBe(date);
    expect(value(readDate(cell, 'month-first'))).toBe(date);
  });

  it('reads 03/04/2025 in the order chosen, and asks when none is', () => {
    expect(value(readDate('03/04/2025', 'day-first'))).toBe('2025-04-03');
    expect(value(readDate('03/04/2025', 'month-first'))).toBe('2025-03-04');
    expect(value(readDate('3.4.2025', 'day-first'))).toBe('2025-04-03');
    expect(value(readDate('03/04/2025', null))).toBe(
      'problem: “03/04/2025” could be day first or month first. Choose the date order above.',
    );
  });

  it('needs no order when the date settles it, and says when it contradicts the choice', () => {
    expect(value(readDate('25/03/2025', null))).toBe('2025-03-25');
    expect(value(readDate('03/25/2025', null))).toBe('2025-03-25');
    expect(value(readDate('04/04/2025', null))).toBe('2025-04-04');
    expect(value(readDate('25/03/2025', 'month-first'))).toBe(
      'problem: “25/03/2025” has the day first, but month first is chosen above.',
    );
  });

  it('refuses dates that are not on the calendar and two-digit years, in words', () => {
    expect(value(readDate('2025-02-30', null))).toBe(
      'problem: “2025-02-30” is not a date on the calendar.',
    );
    expect(value(readDate('31/31/2025', null))).toBe(
      'problem: “31/31/2025” is not a date on the calendar.',
    );
    expect(value(readDate('03/04/25', 'day-first'))).toBe(
      'problem: “03/04/25”: write the year in full, as in 03/04/2025.',
    );
    expect(value(readDate('soon', null))).toBe(
      'problem: “soon” is not a date we can read: write it like 2025-04-03 or 3 Apr 2025.',
    );
  });
});

describe('reading a group and a stage', () => {
  it('takes our names, their labels and common short forms', () => {
    expect(value(readGroup('Tarantula'))).toBe('tarantula');
    expect(value(readGroup('tarantulas'))).toBe('tarantula');
    expect(value(readGroup('True spider'))).toBe('true_spider');
    expect(value(readGroup('true_spider'))).toBe('true_spider');
    expect(value(readGroup('mantid'))).toBe('mantis');
    expect(value(readGroup(''))).toBeNull();
    expect(value(readStage('Sling'))).toBe('sling');
    expect(value(readStage('spiderling'))).toBe('sling');
    expect(value(readStage('juvie'))).toBe('juvenile');
    expect(value(readStage('Sub-adult'))).toBe('subadult');
    expect(value(readStage('Nymph L4+'))).toBe('juvenile');
    expect(value(readStage('first instar'))).toBe('first_instar');
    expect(value(readStage('teenager'))).toBe(
      'problem: “teenager” is not a life stage we know: use sling, juvenile, subadult or adult.',
    );
  });

  it('knows the group of a well-known genus however it is capitalised', () => {
    expect(genusGroup('Grammostola pulchra')).toBe('tarantula');
    expect(genusGroup('caribena versicolor')).toBe('tarantula');
    expect(genusGroup('Hierodula membranacea')).toBe('mantis');
    expect(genusGroup('Arion ater')).toBeNull();
  });
});
