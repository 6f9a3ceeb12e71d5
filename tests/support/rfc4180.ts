/**
 * A strict reader of RFC 4180 §2 (the ABNF `file = [header CRLF] record *(CRLF record)
 * [CRLF]`; `escaped = DQUOTE *(TEXTDATA / COMMA / CR / LF / 2DQUOTE) DQUOTE`). Written from the
 * RFC, independent of the CSV library the app writes with, and stricter than it: a bare LF or
 * CR between records, a quote inside an unquoted field, text after a closing quote or rows of
 * different lengths all throw, so a file that passes here is RFC 4180 to the letter.
 */
export function readRfc4180(text: string): string[][] {
  const records: string[][] = [];
  let i = 0;
  const n = text.length;
  while (i < n) {
    const record: string[] = [];
    for (;;) {
      let field = '';
      if (text[i] === '"') {
        i++;
        for (;;) {
          if (i >= n) throw new Error('RFC 4180: an unterminated quoted field');
          if (text[i] === '"') {
            if (text[i + 1] === '"') {
              field += '"';
              i += 2;
              continue;
            }
            i++;
            break;
          }
          field += text[i++];
        }
      } else {
        while (i < n && text[i] !== ',' && text[i] !== '\r' && text[i] !== '\n') {
          if (text[i] === '"')
            throw new Error(`RFC 4180: a quote inside an unquoted field at ${i}`);
          field += text[i++];
        }
      }
      record.push(field);
      if (text[i] === ',') {
        i++;
        continue;
      }
      if (i >= n) break;
      if (text[i] === '\r' && text[i + 1] === '\n') {
        i += 2;
        break;
      }
      throw new Error(`RFC 4180: records must end in CRLF (at ${i})`);
    }
    if (records.length && record.length !== records[0]!.length)
      throw new Error('RFC 4180: each line should contain the same number of fields');
    records.push(record);
  }
  return records;
}
