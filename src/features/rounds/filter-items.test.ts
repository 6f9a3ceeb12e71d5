import { describe, expect, it } from 'vitest';
import { withOutcome } from '#shared/domain/rounds/settle';
import { sampleRound } from '../../../tests/fixtures/sample-round';
import { filterItems } from './filter-items';

const round = sampleRound();
const names = (items: { animal: { name: string } }[]) => items.map((i) => i.animal.name);

describe('filterItems', () => {
  const bramble = round.items[0]!.animal.id;
  const fedAndWatered = [
    withOutcome(round, bramble, {
      eventId: 'e1',
      kind: 'ate',
      at: '2026-12-01T14:00:00Z',
      by: 'Robin',
    }),
  ].map((r) =>
    withOutcome(r, bramble, {
      eventId: 'e2',
      kind: 'watered',
      at: '2026-12-01T14:01:00Z',
      by: 'Robin',
    }),
  )[0]!;

  it('splits to do and done by whether every counted task has an outcome', () => {
    expect(names(filterItems(fedAndWatered.items, 'to_do', ''))).toEqual(['Dusty']);
    expect(names(filterItems(fedAndWatered.items, 'done', ''))).toEqual(['Bramble']);
    // Fed but not watered is still to do.
    const fedOnly = withOutcome(round, bramble, {
      eventId: 'e1',
      kind: 'ate',
      at: '2026-12-01T14:00:00Z',
      by: 'Robin',
    });
    expect(names(filterItems(fedOnly.items, 'to_do', ''))).toEqual(['Bramble', 'Dusty']);
  });

  it('finds a label code however it is typed, or a name', () => {
    expect(names(filterItems(round.items, 'all', 'nl-c3m'))).toEqual(['Dusty']);
    expect(names(filterItems(round.items, 'all', ' N L - C3 M '))).toEqual(['Dusty']);
    expect(names(filterItems(round.items, 'all', 'nlc3m'))).toEqual(['Dusty']);
    expect(names(filterItems(round.items, 'all', 'bram'))).toEqual(['Bramble']);
    expect(names(filterItems(round.items, 'all', 'albopilosus'))).toEqual(['Bramble', 'Dusty']);
    expect(names(filterItems(round.items, 'all', 'nobody'))).toEqual([]);
  });

  it('shows only animals with cautions under Cautions', () => {
    const withCaution = {
      ...round,
      items: round.items.map((i, n) =>
        n === 1 ? { ...i, animal: { ...i.animal, cautions: ['fast_defensive' as const] } } : i,
      ),
    };
    expect(names(filterItems(withCaution.items, 'cautions', ''))).toEqual(['Dusty']);
  });
});
