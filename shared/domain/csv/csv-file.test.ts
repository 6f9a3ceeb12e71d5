import { describe, expect, it } from 'vitest';
import { readCsv, writeCsv } from './csv-file';

// RFC 4180, section 2: CRLF between records (2.1–2.2); fields with commas, quotes or line
// breaks enclosed in double quotes (2.6); a double quote inside is doubled (2.7).
describe('CSV files (RFC 4180)', () => {
  const tricky = [
    { name: 'Juniper, the big one', note: 'She said "no"' },
    { name: 'Mello-Leitão’s pick', note: 'line one\r\nline two' },
    { name: 'Ñandú 🕷', note: '=SUM(A1:A2)' },
    { name: '', note: '-5 days' },
  ];

  it('writes CRLF records, quotes what needs it and doubles quotes', () => {
    const csv = writeCsv(['name', 'note'], tricky);
    expect(csv.split('\r\n')[0]).toBe('name,note');
    expect(csv).toContain('"Juniper, the big one","She said ""no"""');
    expect(csv).toContain('"line one\r\nline two"');
    // A cell a spreadsheet would run as a formula is neutralised.
    expect(csv).toContain(`"'=SUM(A1:A2)"`);
  });

  it('reads back exactly what it wrote, with the line each record starts on', () => {
    const table = readCsv(writeCsv(['name', 'note'], tricky));
    expect(table.headers).toEqual(['name', 'note']);
    expect(table.records.map((r) => r.cells)).toEqual(tricky.map((t) => [t.name, t.note]));
    // Record 2 holds a line break, so record 3 starts on line 5, not 4.
    expect(table.records.map((r) => r.line)).toEqual([2, 3, 5, 6]);
  });

  it('reads LF-only files, a byte-order mark and blank lines as people save them', () => {
    const table = readCsv('\uFEFFname,stage\nA,adult\n\nB,sling\n');
    expect(table.headers).toEqual(['name', 'stage']);
    expect(table.records).toEqual([
      { line: 2, cells: ['A', 'adult'] },
      { line: 4, cells: ['B', 'sling'] },
    ]);
  });

  it('numbers lines the same with CRLF, CR or LF line ends and a quoted line break', () => {
    for (const eol of ['\r\n', '\r', '\n']) {
      const table = readCsv(['name,note', 'A,"one', 'two"', '', 'B,x', 'C,y'].join(eol));
      expect(table.records.map((r) => [r.line, r.cells[0]])).toEqual([
        [2, 'A'],
        [5, 'B'],
        [6, 'C'],
      ]);
    }
  });

  it('reads an inch mark the same whether quoted by the rules or typed by hand', () => {
    // § 2.7: inside a quoted field a double quote is doubled, so 4" is written "4""".
    // § 2.5: an unquoted field "may not" hold a double quote; a hand-typed 4" does, and is read
    // as the text it plainly is rather than refused.
    const quoted = readCsv('Name,Size\r\nBram,"4"""\r\n');
    const typed = readCsv('Name,Size\nBram,4"\n');
    expect(quoted.records[0]!.cells).toEqual(['Bram', '4"']);
    expect(typed.records[0]!.cells).toEqual(['Bram', '4"']);
    expect(readCsv(writeCsv(['Size'], [{ Size: '4"' }])).records[0]!.cells).toEqual(['4"']);
  });
});
