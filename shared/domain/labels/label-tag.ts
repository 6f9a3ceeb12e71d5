import { labelUrl, readLabel, type LabelReading } from './label-payload';

/**
 * NFC tags carry the same identifier as the printed QR: the label's URL, `<ORIGIN>/L/<TAG>/<CODE>`
 * (decision 006). A phone's own NFC reader opens that address like a camera app opens the QR,
 * and Rackside's Scan screen reads it through the same `readLabel` as a scanned QR.
 *
 * W3C Web NFC (Community Group report; from memory): an NDEF record of `recordType` "url" holds
 * a URL as text, stored on the tag as an NFC Forum URI record (RTD-URI), whose one-byte
 * identifier code the browser applies both ways (0x03 "http://", 0x04 "https://"), so the page
 * writes and reads the whole URL. "absolute-url" is the same address as an NDEF absolute-URI
 * record; "smart-poster" wraps a "url" record with a title and an action.
 */

/** An NDEF record as the Scan screen hands it over: its type, its text (for URL and text
 * records, already decoded) and nested records (a smart poster's). */
export interface TagRecord {
  recordType: string;
  text?: string | null;
  records?: readonly TagRecord[];
}

/** The message a tag for this label gets: one "url" record, the label's own URL. */
export function labelTagMessage(origin: string, tag: string, code: string) {
  return { records: [{ recordType: 'url' as const, data: labelUrl(origin, tag, code) }] };
}

const URL_RECORDS = new Set(['url', 'absolute-url']);

/** The first web address on the tag (a smart poster's included), or null. */
export function tagUrl(records: readonly TagRecord[]): string | null {
  for (const record of records) {
    if (URL_RECORDS.has(record.recordType) && record.text) return record.text;
    if (record.recordType === 'smart-poster' && record.records) {
      const inner = tagUrl(record.records);
      if (inner) return inner;
    }
  }
  return null;
}

/**
 * What a tag says, the way a scanned QR says it: its URL through `readLabel`. A tag is never a
 * typed code, so text that is not an address (or no URL record at all) is someone else's tag.
 */
export function readTag(records: readonly TagRecord[]): LabelReading {
  const url = tagUrl(records);
  if (!url || !/^[a-z][a-z0-9+.-]*:\/\//i.test(url.trim())) return { kind: 'foreign' };
  return readLabel(url);
}
