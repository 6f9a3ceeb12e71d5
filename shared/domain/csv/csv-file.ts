import Papa from 'papaparse';

/**
 * CSV as RFC 4180 has it: records end in CRLF; a field holding a comma, a double quote or a line
 * break is quoted, and a quote inside is doubled. Cells that a spreadsheet would run as a
 * formula (starting = + - @, tab or CR) are written with a leading apostrophe (OWASP "CSV
 * Injection"), which `readCsv` takes off again so a round trip loses nothing.
 */
export function writeCsv(
  fields: readonly string[],
  rows: readonly Record<string, string>[],
): string {
  return Papa.unparse(
    { fields: [...fields], data: rows.map((r) => fields.map((f) => r[f] ?? '')) },
    { newline: '\r\n', escapeFormulae: true },
  );
}

/** Records only, no header: a long file written a page at a time (join pages with CRLF). */
export function writeCsvRecords(
  fields: readonly string[],
  rows: readonly Record<string, string>[],
): string {
  return Papa.unparse(
    { fields: [...fields], data: rows.map((r) => fields.map((f) => r[f] ?? '')) },
    { newline: '\r\n', escapeFormulae: true, header: false },
  );
}

export interface CsvRecord {
  /** The line the record starts on in the file (1 is the header), as a text editor counts. */
  line: number;
  cells: string[];
}
export interface CsvTable {
  headers: string[];
  records: CsvRecord[];
}

const FORMULA_GUARD = /^'(?=[=+\-@\t\r])/;

export function readCsv(text: string): CsvTable {
  const source = text.replace(/^\uFEFF/, '');
  const rows: CsvRecord[] = [];
  let consumed = 0;
  let line = 1;
  Papa.parse<string[]>(source, {
    skipEmptyLines: 'greedy',
    step: (result) => {
      // Lines before this record: count the line breaks up to where it started.
      const start = consumed;
      consumed = result.meta.cursor;
      const before = source.slice(0, start);
      line = 1 + (before.match(/\r\n|\r|\n/g)?.length ?? 0);
      // A blank line skipped before the record moves its start further down.
      const lead = source.slice(start).match(/^(?:\r\n|\r|\n)*/)![0];
      rows.push({
        line: line + (lead.match(/\r\n|\r|\n/g)?.length ?? 0),
        cells: result.data.map((c) => c.replace(FORMULA_GUARD, '')),
      });
    },
  });
  const [header, ...records] = rows;
  return { headers: header?.cells.map((h) => h.trim()) ?? [], records };
}
