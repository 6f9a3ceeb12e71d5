import type { AnimalImportValues } from '../../schemas/import';
import type { AnimalGroup, LifeStage, Sex } from '../animal-facts';
import {
  guessColumn,
  REQUIRED_COLUMNS,
  rowToAnimal,
  type AnimalColumn,
  type RowResult,
} from '../csv/animal-columns';
import type { CsvTable } from '../csv/csv-file';
import { codeKey } from '../labels/label-payload';
import {
  genusGroup,
  isAmbiguous,
  numericDate,
  readingsOf,
  readSize,
  unitInHeader,
  type DateOrder,
  type SizeInputUnit,
} from './cell-readers';

/** What the keeper decides for a whole file: where each column goes and how to read what needs it. */
export interface ImportSettings {
  /** Our column for each of the file's columns, in the file's order; null leaves it out. */
  mapping: (AnimalColumn | null)[];
  /** For rows whose cell is blank, or all rows when the file has no such column. */
  defaults: { group: AnimalGroup | null; stage: LifeStage | null; sex: Sex };
  /** Only read for dates such as 03/04/2025 that could be either. */
  dateOrder: DateOrder | null;
  /** The unit of a size written as a bare number. */
  sizeUnit: SizeInputUnit;
}

const DATE_COLUMNS: readonly AnimalColumn[] = ['acquired_on', 'do_not_feed_until'];

/** Each row's cells by our column names, under a mapping (a later column wins a clash). */
function cellsOf(table: CsvTable, mapping: readonly (AnimalColumn | null)[]) {
  return table.records.map((r) => {
    const cells: Partial<Record<AnimalColumn, string>> = {};
    mapping.forEach((column, i) => {
      if (column) cells[column] = r.cells[i] ?? '';
    });
    return { line: r.line, cells };
  });
}

export interface DateExample {
  line: number;
  cell: string;
}
/** What the file's own dates say about their order. */
export interface DateEvidence {
  /** The first date that reads two ways, with both readings in words. */
  ambiguous: (DateExample & { readings: Record<DateOrder, string> }) | null;
  /** The first date that can only be read one way, for each order. */
  only: Record<DateOrder, DateExample | null>;
}

export function dateEvidence(
  table: CsvTable,
  mapping: readonly (AnimalColumn | null)[],
): DateEvidence {
  const evidence: DateEvidence = {
    ambiguous: null,
    only: { 'day-first': null, 'month-first': null },
  };
  for (const { line, cells } of cellsOf(table, mapping)) {
    for (const column of DATE_COLUMNS) {
      const cell = (cells[column] ?? '').trim();
      const d = numericDate(cell);
      if (!d) continue;
      if (isAmbiguous(d)) evidence.ambiguous ??= { line, cell, readings: readingsOf(d) };
      else if (d.first > 12 && d.second <= 12) evidence.only['day-first'] ??= { line, cell };
      else if (d.second > 12 && d.first <= 12) evidence.only['month-first'] ??= { line, cell };
    }
  }
  return evidence;
}

/** The order the file's unambiguous dates settle, when they all agree. */
export function settledDateOrder(evidence: DateEvidence): DateOrder | null {
  const { 'day-first': day, 'month-first': month } = evidence.only;
  return day && !month ? 'day-first' : month && !day ? 'month-first' : null;
}

/** A first guess at everything, from the headers and the cells themselves. */
export function firstSettings(
  table: CsvTable,
  preferredUnit: SizeInputUnit = 'mm',
): ImportSettings {
  const mapping = table.headers.map((h) => guessColumn(h));
  // Two headers guessed as the same column: keep the first, leave the other for the keeper.
  const deduped = mapping.map((c, i) => (c && mapping.indexOf(c) !== i ? null : c));
  const evidence = dateEvidence(table, deduped);
  return {
    mapping: deduped,
    defaults: { group: null, stage: null, sex: 'unknown' },
    dateOrder: evidence.ambiguous ? settledDateOrder(evidence) : null,
    sizeUnit: sizeUnitFor(table, deduped) ?? preferredUnit,
  };
}

/** The unit the size column's header names ("Size (in)", "size_mm"), if any. */
export function sizeUnitFor(
  table: CsvTable,
  mapping: readonly (AnimalColumn | null)[],
): SizeInputUnit | null {
  const i = mapping.indexOf('size_mm');
  return i < 0 ? null : unitInHeader(table.headers[i] ?? '');
}

/** What the screen has to ask, given where the columns go. */
export interface ImportQuestions {
  /** Needed columns no file column goes to. */
  missing: AnimalColumn[];
  /** Our columns that two or more file columns go to. */
  doubled: AnimalColumn[];
  /** Rows that give no group and whose genus we do not know. */
  withoutGroup: number;
  /** Rows that give no life stage. */
  withoutStage: number;
  /** Rows with the sex left blank. */
  withoutSex: number;
  /** Rows whose size is a bare number. */
  bareSizes: number;
  dates: DateEvidence;
}

export function questionsFor(
  table: CsvTable,
  mapping: readonly (AnimalColumn | null)[],
): ImportQuestions {
  const rows = cellsOf(table, mapping);
  const blank = (v: string | undefined) => (v ?? '').trim() === '';
  const count = (test: (cells: Partial<Record<AnimalColumn, string>>) => boolean) =>
    rows.filter((r) => test(r.cells)).length;
  return {
    missing: REQUIRED_COLUMNS.filter((c) => !mapping.includes(c)),
    doubled: [
      ...new Set(mapping.filter((c, i): c is AnimalColumn => !!c && mapping.indexOf(c) !== i)),
    ],
    // A row's genus gives its group when we know the genus; ask only for the others.
    withoutGroup: count((c) => blank(c.group) && !genusGroup(c.scientific_name ?? '')),
    withoutStage: count((c) => blank(c.stage)),
    withoutSex: count((c) => blank(c.sex)),
    bareSizes: count((c) => {
      const cell = c.size_mm ?? '';
      const mm = readSize(cell, 'mm');
      const inches = readSize(cell, 'in');
      return mm.ok && inches.ok && mm.value !== inches.value;
    }),
    dates: dateEvidence(table, mapping),
  };
}

export interface PlannedRow {
  line: number;
  /** The row's name cell, to point at it in words. */
  name: string;
  /** The cells as written, by our columns: shown beside what they were read as. */
  cells: Partial<Record<AnimalColumn, string>>;
  result: RowResult;
}
export interface ImportPlan {
  rows: PlannedRow[];
  /** The rows to send, in the file's order. */
  ready: AnimalImportValues[];
  /** The same rows with their cells as written. */
  readyRows: (PlannedRow & { result: { ok: true } })[];
  problems: (PlannedRow & { result: { ok: false } })[];
}

/**
 * Every row read with the keeper's settings: those ready to import, and each problem row with
 * its problems in words. A label code already in the collection, or twice in the file, is one.
 */
export function planImport(
  table: CsvTable,
  settings: ImportSettings,
  takenCodes: readonly string[],
): ImportPlan {
  const taken = new Set(takenCodes.map(codeKey));
  const seen = new Set<string>();
  const rows = cellsOf(table, settings.mapping).map(({ line, cells }): PlannedRow => {
    const name = (cells.name ?? '').trim();
    const result = rowToAnimal(cells, settings);
    const code = result.ok && result.value.labelCode ? codeKey(result.value.labelCode) : '';
    if (code && (taken.has(code) || seen.has(code)))
      return {
        line,
        name,
        cells,
        result: {
          ok: false,
          errors: [
            `Label code: ${result.ok ? result.value.labelCode : ''} is already used${taken.has(code) ? ' in this collection' : ' by an earlier row'}.`,
          ],
        },
      };
    if (code) seen.add(code);
    return { line, name, cells, result };
  });
  return {
    rows,
    ready: rows.flatMap((r) => (r.result.ok ? [r.result.value] : [])),
    readyRows: rows.filter((r): r is PlannedRow & { result: { ok: true } } => r.result.ok),
    problems: rows.filter((r): r is PlannedRow & { result: { ok: false } } => !r.result.ok),
  };
}
