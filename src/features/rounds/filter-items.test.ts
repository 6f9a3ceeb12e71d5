import { describe, expect, it } from 'vitest';
import { withOutcome } from '#shared/domain/rounds/settle';
import type { RoundItemView } from '#shared/schemas/rounds';
import { sampleRound } from '../../../tests/fixtures/sample-round';
import {
  DEFAULT_FILTER,
  filterItems,
  itemState,
  roundCounts,
  storedFilter,
  storeFilter,
} from './filter-items';

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

  it('shows only animals with a handling caution under Take care, not the hairs most carry', () => {
    const withCaution = {
      ...round,
      items: round.items.map((i, n) => ({
        ...i,
        animal: {
          ...i.animal,
          cautions:
            n === 1
              ? (['urticating_hairs', 'fast_defensive'] as const).slice()
              : (['urticating_hairs'] as const).slice(),
        },
      })),
    };
    expect(names(filterItems(withCaution.items, 'cautions', ''))).toEqual(['Dusty']);
    expect(roundCounts(withCaution.items).cards.cautions).toBe(1);
  });

  const placed = (item: RoundItemView, rack: string, shelf: string, position: string) => ({
    ...item,
    animal: {
      ...item.animal,
      location: {
        id: `${rack}${shelf}${position}`,
        room: 'Spider room',
        rack,
        shelf,
        position,
        walkOrder: 1,
      },
    },
  });
  const withPlaces = [
    placed(round.items[0]!, 'A', '1', '2'),
    placed(round.items[1]!, 'C', '3', '12'),
  ];

  it('finds the place code printed on the card, typed any way, and a whole shelf by its prefix', () => {
    expect(names(filterItems(withPlaces, 'all', 'A1-2'))).toEqual(['Bramble']);
    expect(names(filterItems(withPlaces, 'all', 'a1 2'))).toEqual(['Bramble']);
    expect(names(filterItems(withPlaces, 'all', 'c3/12'))).toEqual(['Dusty']);
    expect(names(filterItems(withPlaces, 'all', 'C3'))).toEqual(['Dusty']);
    // "C3-1" is the start of C3-12: a prefix, as the shelf is.
    expect(names(filterItems(withPlaces, 'all', 'C3-1'))).toEqual(['Dusty']);
    expect(names(filterItems(withPlaces, 'all', 'A1-3'))).toEqual([]);
    // Leading zeros are the same spot, either way round.
    expect(names(filterItems(withPlaces, 'all', 'a1-02'))).toEqual(['Bramble']);
    const padded = [placed(round.items[1]!, 'C', '1', '08')];
    expect(names(filterItems(padded, 'all', 'C1-8'))).toEqual(['Dusty']);
    expect(names(filterItems(padded, 'all', 'c1 08'))).toEqual(['Dusty']);
    // A word is still a name search, not a place.
    expect(names(filterItems(withPlaces, 'all', 'dust'))).toEqual(['Dusty']);
  });

  it('keeps a card finished since the filter was chosen under To do, and only that one', () => {
    const kept = new Set([bramble]);
    expect(names(filterItems(fedAndWatered.items, 'to_do', '', kept))).toEqual([
      'Bramble',
      'Dusty',
    ]);
    expect(names(filterItems(fedAndWatered.items, 'to_do', ''))).toEqual(['Dusty']);
    // Kept cards still answer to the search.
    expect(names(filterItems(fedAndWatered.items, 'to_do', 'dusty', kept))).toEqual(['Dusty']);
  });
});

describe('roundCounts', () => {
  it('counts animals for the chips and the progress line alike, and tasks beside them', () => {
    const bramble = round.items[0]!.animal.id;
    const fed = withOutcome(round, bramble, {
      eventId: 'e1',
      kind: 'ate',
      at: '2026-12-01T14:00:00Z',
      by: 'Robin',
    });
    const watered = withOutcome(fed, bramble, {
      eventId: 'e2',
      kind: 'watered',
      at: '2026-12-01T14:01:00Z',
      by: 'Robin',
    });
    expect(roundCounts(fed.items)).toMatchObject({
      cards: { to_do: 2, done: 0, all: 2 },
      animals: { done: 0, total: 2 },
      tasks: { done: 1, total: 3 },
    });
    const counts = roundCounts(watered.items);
    expect(counts).toMatchObject({
      cards: { to_do: 1, done: 1, all: 2 },
      animals: { done: 1, total: 2 },
      tasks: { done: 2, total: 3 },
      reminders: 0,
    });
    // The chips add up to All, and Done is the progress line's count.
    expect(counts.cards.to_do + counts.cards.done).toBe(counts.cards.all);
    expect(counts.cards.done).toBe(counts.animals.done);
  });

  it('shows a leave-alone card under To do as a reminder, outside the animals to finish', () => {
    const leave = {
      ...round.items[1]!,
      tasks: [{ kind: 'leave_alone' as const, reasons: [], carriedOverDays: 0, done: null }],
    };
    expect(itemState(leave)).toBe('info');
    const items = [round.items[0]!, leave];
    expect(names(filterItems(items, 'to_do', ''))).toEqual(['Bramble', 'Dusty']);
    expect(names(filterItems(items, 'done', ''))).toEqual([]);
    expect(roundCounts(items)).toMatchObject({
      cards: { to_do: 2, done: 0, all: 2 },
      animals: { done: 0, total: 1 },
      reminders: 1,
    });
  });

  it('keeps a finished card with a warning under To do too: it wants a look', () => {
    // Two phones both recorded a meal for Dusty: the round warns "fed twice".
    const dusty = round.items[1]!.animal.id;
    const fed = withOutcome(
      withOutcome(round, dusty, {
        eventId: 'e1',
        kind: 'ate',
        at: '2026-12-01T14:00:00Z',
        by: 'Robin',
      }),
      dusty,
      { eventId: 'e2', kind: 'ate', at: '2026-12-01T14:05:00Z', by: 'Alex' },
    );
    expect(fed.items[1]!.warnings.join()).toMatch(/twice/);
    expect(itemState(fed.items[1]!)).toBe('done');
    expect(names(filterItems(fed.items, 'to_do', ''))).toEqual(['Bramble', 'Dusty']);
    expect(names(filterItems(fed.items, 'done', ''))).toEqual(['Dusty']);
    expect(roundCounts(fed.items).cards).toMatchObject({ to_do: 2, done: 1, all: 2 });
  });
});

describe('the filter stored on this device', () => {
  it('starts at To do, remembers a choice and ignores anything it does not know', () => {
    const store = new Map<string, string>();
    const storage = {
      getItem: (k: string) => store.get(k) ?? null,
      setItem: (k: string, v: string) => void store.set(k, v),
    };
    expect(DEFAULT_FILTER).toBe('to_do');
    expect(storedFilter(storage)).toBe('to_do');
    storeFilter(storage, 'all');
    expect(storedFilter(storage)).toBe('all');
    store.set('rackside.round-filter', 'everything');
    expect(storedFilter(storage)).toBe('to_do');
    const broken = {
      getItem: () => {
        throw new Error('denied');
      },
    };
    expect(storedFilter(broken)).toBe('to_do');
  });
});
