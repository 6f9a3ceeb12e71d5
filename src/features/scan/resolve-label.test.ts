import { describe, expect, it } from 'vitest';
import { labelUrl, readLabel } from '#shared/domain/labels/label-payload';
import { readTag } from '#shared/domain/labels/label-tag';
import { sampleAnimal, sampleRound } from '../../../tests/fixtures/sample-round';
import { resolveLabel, targetMessage } from './resolve-label';

const round = sampleRound();
const juniper = sampleAnimal({ labelCode: 'NL-7K3' });
const keeper: Parameters<typeof resolveLabel>[1] = {
  collection: { labelTag: 'ABCD' },
  memberships: [
    { labelTag: 'ABCD', collectionName: 'Northlight Inverts', collectionId: 'c1' },
    { labelTag: 'WXYZ', collectionName: 'Club loan animals', collectionId: 'c2' },
  ],
  roundItems: round.items,
  animals: [juniper],
};
const resolve = (raw: string, ctx = keeper) => resolveLabel(readLabel(raw), ctx);

describe('resolving a scan or a typed code', () => {
  it('opens the round item for a label on today’s round, scanned or typed in any case', () => {
    expect(resolve('HTTP://LOCALHOST:3000/L/ABCD/NL-B7K')).toMatchObject({
      kind: 'on_round',
      item: { animal: { name: 'Bramble' } },
    });
    expect(resolve(' nl b7k ')).toMatchObject({
      kind: 'on_round',
      item: { animal: { name: 'Bramble' } },
    });
  });

  it('offers an animal off today’s round as not due, with no tasks', () => {
    const target = resolve('http://localhost:3000/l/abcd/nl-7k3');
    expect(target).toMatchObject({
      kind: 'not_due',
      item: { animal: { id: juniper.id, name: 'Juniper' }, tasks: [] },
    });
  });

  it('names the other collection a label belongs to, when the person is in it', () => {
    expect(resolve('HTTP://LOCALHOST:3000/L/WXYZ/NL-7K3')).toEqual({
      kind: 'other_collection',
      collectionId: 'c2',
      collectionName: 'Club loan animals',
    });
    expect(resolve('HTTP://LOCALHOST:3000/L/QQQQ/NL-7K3')).toEqual({
      kind: 'other_collection',
      collectionId: null,
      collectionName: null,
    });
  });

  it('says so for unknown codes, off-round animals for helpers, damaged and foreign codes', () => {
    expect(resolve('NL-2222')).toEqual({ kind: 'unknown_code', code: 'NL-2222' });
    expect(resolve('NL-7K3', { ...keeper, animals: null })).toEqual({
      kind: 'not_on_round',
      code: 'NL-7K3',
    });
    expect(resolve('NL-7K3', { ...keeper, animals: undefined })).toEqual({
      kind: 'list_missing',
      code: 'NL-7K3',
    });
    expect(resolve('NL-7KO')).toEqual({ kind: 'malformed' });
    expect(resolve('https://example.com/')).toEqual({ kind: 'foreign' });
    expect(targetMessage({ kind: 'foreign' }).title).toMatch(/not a Rackside label/);
    expect(
      targetMessage({
        kind: 'other_collection',
        collectionId: 'c2',
        collectionName: 'Club loan animals',
      }).title,
    ).toBe('This label belongs to Club loan animals.');
  });

  it('opens the same thing from an NFC tag as from the label’s QR, with words for other tags', () => {
    const url = labelUrl('https://rackside.example.org', 'ABCD', 'NL-B7K');
    const fromTag = resolveLabel(readTag([{ recordType: 'url', text: url }]), keeper);
    expect(fromTag).toEqual(resolve(url));
    expect(fromTag).toMatchObject({ kind: 'on_round', item: { animal: { name: 'Bramble' } } });
    const other = resolveLabel(
      readTag([{ recordType: 'url', text: 'https://example.com/' }]),
      keeper,
    );
    expect(other).toEqual({ kind: 'foreign' });
    expect(targetMessage({ kind: 'foreign' }, 'nfc').title).toBe('That tag is not a Rackside tag.');
    expect(targetMessage({ kind: 'malformed' }, 'nfc').title).toMatch(/damaged label address/);
  });
});
