import type { TagRecord } from '#shared/domain/labels/label-tag';

/*
 * Web NFC, as the W3C Web NFC Community Group report describes it (https://w3c.github.io/web-nfc/;
 * the details below from memory): one `NDEFReader` both writes (`write(message, { signal })`,
 * resolved once a tag has taken the message) and reads (`scan({ signal })`, resolved once the
 * phone listens; each tag then fires `reading`, or `readingerror` when it cannot be read).
 * Both need a secure context and, for the permission prompt, a user gesture; both stop when the
 * signal aborts. Chrome on Android has it; desktop browsers and iOS do not, and there the
 * controls are not drawn at all. TypeScript's DOM library does not declare it, hence these types.
 */

interface NdefRecordInit {
  recordType: string;
  data?: string;
}
interface NdefRecord {
  recordType: string;
  encoding?: string | null;
  data?: DataView | null;
  toRecords?: () => NdefRecord[] | null;
}
interface NdefReadingEvent extends Event {
  serialNumber?: string;
  message: { records: readonly NdefRecord[] };
}
interface NdefReader extends EventTarget {
  scan(options?: { signal?: AbortSignal }): Promise<void>;
  write(
    message: { records: NdefRecordInit[] },
    options?: { overwrite?: boolean; signal?: AbortSignal },
  ): Promise<void>;
}
type NdefReaderClass = new () => NdefReader;

/** Whether this browser offers Web NFC (feature detection as the report advises). */
export function nfcAvailable(): boolean {
  return typeof window !== 'undefined' && 'NDEFReader' in window;
}

function newReader(): NdefReader {
  return new (window as unknown as { NDEFReader: NdefReaderClass }).NDEFReader();
}

/** Writes one message; rejects with the browser's DOMException (see `nfcProblem`). */
export function writeTag(message: { records: NdefRecordInit[] }, signal: AbortSignal) {
  // overwrite: true (the default) replaces whatever the tag held: a relabelled animal's tag
  // is written again over its old address.
  return newReader().write(message, { overwrite: true, signal });
}

const TEXT_RECORDS = new Set(['url', 'absolute-url', 'text']);

/** A browser NDEF record as plain data: URL and text records decoded (UTF-8 unless it says). */
function toTagRecord(record: NdefRecord, depth = 0): TagRecord {
  let text: string | null = null;
  if (TEXT_RECORDS.has(record.recordType) && record.data) {
    try {
      text = new TextDecoder(record.encoding ?? 'utf-8').decode(record.data);
    } catch {
      text = null;
    }
  }
  let records: TagRecord[] | undefined;
  if (record.recordType === 'smart-poster' && depth < 2) {
    try {
      records = (record.toRecords?.() ?? []).map((r) => toTagRecord(r, depth + 1));
    } catch {
      records = undefined;
    }
  }
  return { recordType: record.recordType, text, records };
}

/**
 * Listens for tags until the signal aborts: each tag's records go to `onTag`, an unreadable tag
 * (not NDEF, moved away too soon) to `onUnreadable`. Resolves once the phone listens.
 */
export async function readTags(
  onTag: (records: TagRecord[]) => void,
  onUnreadable: () => void,
  signal: AbortSignal,
): Promise<void> {
  const reader = newReader();
  reader.addEventListener(
    'reading',
    (event) => onTag((event as NdefReadingEvent).message.records.map((r) => toTagRecord(r))),
    { signal },
  );
  reader.addEventListener('readingerror', onUnreadable, { signal });
  await reader.scan({ signal });
}

export type NfcProblem = 'denied' | 'unsupported' | 'off' | 'moved' | 'cancelled' | 'failed';

/**
 * The report's DOMException names (write and scan algorithms; from memory): NotAllowedError — the
 * person or the site settings refused NFC, or (write) the tag may not be written; NotSupportedError
 * — no NFC adapter the page may use, or a tag that cannot take an NDEF message; NotReadableError —
 * NFC is off in the phone's settings; NetworkError — the tag left before the transfer finished;
 * AbortError — our own signal.
 */
export function nfcProblem(error: unknown): NfcProblem {
  const name =
    typeof error === 'object' && error !== null && 'name' in error ? String(error.name) : '';
  switch (name) {
    case 'NotAllowedError':
    case 'SecurityError':
      return 'denied';
    case 'NotSupportedError':
      return 'unsupported';
    case 'NotReadableError':
      return 'off';
    case 'NetworkError':
      return 'moved';
    case 'AbortError':
      return 'cancelled';
    default:
      return 'failed';
  }
}

/** Plain words for each problem, as writing or as reading meets it. */
export function nfcProblemWords(
  problem: NfcProblem | 'timeout',
  doing: 'write' | 'read',
): { title: string; body: string } {
  switch (problem) {
    case 'denied':
      return doing === 'write'
        ? {
            title: 'The tag was not written.',
            body: 'Either NFC is not allowed for this site (allow it in the browser’s site settings, the icon beside the address) or this tag is locked against writing (use another tag).',
          }
        : {
            title: 'Rackside may not use NFC.',
            body: 'Allow NFC for this site in the browser’s site settings (the icon beside the address), then tap “Read NFC tags” again. The camera works meanwhile.',
          };
    case 'unsupported':
      return doing === 'write'
        ? {
            title: 'This tag cannot hold a web address.',
            body: 'Use an NDEF tag (NTAG213 or larger holds a label’s address), or check that the phone has NFC.',
          }
        : {
            title: 'This phone cannot read NFC tags here.',
            body: 'Use the camera or type the code instead.',
          };
    case 'off':
      return {
        title: 'NFC is switched off.',
        body: 'Turn NFC on in the phone’s settings, then try again.',
      };
    case 'moved':
      return {
        title:
          doing === 'write' ? 'The tag moved away before it was written.' : 'The tag moved away.',
        body: 'Hold it still against the back of the phone until the phone confirms.',
      };
    case 'timeout':
      return {
        title: 'No tag came near the phone.',
        body: 'Hold the tag flat against the back of the phone, near the middle or the top, and try again.',
      };
    case 'cancelled':
      return { title: 'Cancelled.', body: 'Nothing was written.' };
    case 'failed':
      return {
        title: doing === 'write' ? 'The tag could not be written.' : 'NFC reading stopped.',
        body: 'Try again, or use the QR label.',
      };
  }
}
