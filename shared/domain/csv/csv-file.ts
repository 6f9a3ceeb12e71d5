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

/** Line breaks (CRLF, CR or LF, each one break) in source[from, to). */
function breaksBetween(source: string, from: number, to: number): number {
  let n = 0;
  for (let i = from; i < to; i++) {
    const c = source.charCodeAt(i);
    if (c === 10 || (c === 13 && source.charCodeAt(i + 1) !== 10)) n++;
  }
  return n;
}

export function readCsv(text: string): CsvTable {
  const source = text.replace(/^\uFEFF/, '');
  const rows: (CsvRecord & { start: number })[] = [];
  // Counted on from the previous record, never from the start again: a 5000-row file stays quick.
  let consumed = 0;
  let line = 1;
  const lead = /(?:\r\n|\r|\n)*/y;
  Papa.parse<string[]>(source, {
    skipEmptyLines: 'greedy',
    step: (result) => {
      const start = consumed;
      consumed = result.meta.cursor;
      line += breaksBetween(source, rows.length ? rows.at(-1)!.start : 0, start);
      // A blank line skipped before the record moves its start further down.
      lead.lastIndex = start;
      const skipped = lead.exec(source)![0].length;
      rows.push({
        start,
        line: line + breaksBetween(source, start, start + skipped),
        cells: result.data.map((c) => c.replace(FORMULA_GUARD, '')),
      });
    },
  });
  const [header, ...records] = rows.map(({ line, cells }) => ({ line, cells }));
  return { headers: header?.cells.map((h) => h.trim()) ?? [], records };
}
