import { describe, expect, it } from 'vitest';
import { labelUrl, readLabel } from './label-payload';
import { labelTagMessage, readTag, tagUrl } from './label-tag';

const ORIGIN = 'https://rackside.example.org';
const URL = labelUrl(ORIGIN, 'AB7K', 'NL-7K3');

describe('NFC tags hold the label URL', () => {
  it('writes one "url" record with exactly the QR label’s URL', () => {
    expect(labelTagMessage(ORIGIN, 'AB7K', 'NL-7K3')).toEqual({
      records: [{ recordType: 'url', data: 'HTTPS://RACKSIDE.EXAMPLE.ORG/L/AB7K/NL-7K3' }],
    });
    expect(labelTagMessage(`${ORIGIN}/`, 'AB7K', 'NL-7K3').records[0]!.data).toBe(URL);
  });

  it('reads a tag through the same parser as a scanned QR', () => {
    const records = [{ recordType: 'url', text: URL }];
    expect(readTag(records)).toEqual(readLabel(URL));
    expect(readTag(records)).toEqual({ kind: 'label', tag: 'AB7K', code: 'NL-7K3' });
    // Written by a phone's own NFC app in lower case, as an absolute URL or in a smart poster.
    expect(readTag([{ recordType: 'absolute-url', text: URL.toLowerCase() }])).toEqual({
      kind: 'label',
      tag: 'AB7K',
      code: 'NL-7K3',
    });
    expect(
      readTag([
        {
          recordType: 'smart-poster',
          records: [
            { recordType: 'text', text: 'Aragog' },
            { recordType: 'url', text: URL },
          ],
        },
      ]),
    ).toEqual({ kind: 'label', tag: 'AB7K', code: 'NL-7K3' });
  });

  it('takes the first web address and skips other records', () => {
    expect(
      tagUrl([
        { recordType: 'mime', text: null },
        { recordType: 'text', text: 'hello' },
        { recordType: 'url', text: URL },
      ]),
    ).toBe(URL);
    expect(tagUrl([{ recordType: 'empty' }])).toBeNull();
  });

  it('tells other tags apart from damaged labels', () => {
    expect(readTag([])).toEqual({ kind: 'foreign' });
    expect(readTag([{ recordType: 'empty' }])).toEqual({ kind: 'foreign' });
    expect(readTag([{ recordType: 'url', text: 'https://example.com/menu' }])).toEqual({
      kind: 'foreign',
    });
    // A text record with a code is not a label: tags carry the URL only.
    expect(readTag([{ recordType: 'text', text: 'NL-7K3' }])).toEqual({ kind: 'foreign' });
    expect(readTag([{ recordType: 'url', text: 'NL-7K3' }])).toEqual({ kind: 'foreign' });
    expect(readTag([{ recordType: 'url', text: `${ORIGIN}/L/AB7K/NL-7KO` }])).toEqual({
      kind: 'malformed',
    });
  });
});
