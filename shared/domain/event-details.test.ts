import { describe, expect, it } from 'vitest';
import { eventDetails } from './event-details';

describe('an event’s details in words (history CSV)', () => {
  it('writes a meal and a refusal with their prey and note', () => {
    expect(
      eventDetails('ate', { preyType: 'cricket', preySize: 'small', count: 2, note: 'at once' }),
    ).toBe('2 × cricket, small · note: at once');
    expect(eventDetails('refused', { preyType: 'roach nymph' })).toBe('roach nymph');
  });

  it('writes a molt’s facts', () => {
    expect(
      eventDetails('molted', { sizeMm: 136, sexFromExuviae: 'female', exuviaeKept: true }),
    ).toBe('size 136 mm · exuviae shows female · exuviae kept');
  });

  it('names the male and the places it is given, and never prints an id it cannot name', () => {
    const names = {
      animal: (id: string) => (id === 'm1' ? 'Blue Jay (NL-7K3)' : undefined),
      place: (id: string) => ({ p1: 'A1-2', p2: 'B3-1' })[id],
    };
    expect(eventDetails('paired', { maleId: 'm1', outcome: 'accepted' }, names)).toBe(
      'with Blue Jay (NL-7K3) · accepted',
    );
    expect(eventDetails('paired', { maleId: 'gone' }, names)).toBe('with a male of the collection');
    expect(
      eventDetails('moved', { fromLocationId: 'p1', toLocationId: 'p2', rehoused: true }, names),
    ).toBe('from A1-2 to B3-1 · into a new enclosure');
    expect(eventDetails('moved', { toLocationId: 'p9' }, names)).toBe('');
  });

  it('writes status changes, notes and breeding counts; an empty payload is empty', () => {
    expect(eventDetails('status_changed', { from: 'active', to: 'sold' })).toBe('Kept → Sold');
    expect(eventDetails('note', { text: 'Webbed the whole hide.' })).toBe('Webbed the whole hide.');
    expect(eventDetails('sac_pulled', { sacId: 'x', eggCount: 140 })).toBe('140 eggs');
    expect(eventDetails('brood_started', { count: 23 })).toBe('23 young');
    expect(eventDetails('watered', {})).toBe('');
    expect(JSON.stringify(eventDetails('sac_laid', { sacId: 'abc' }))).not.toMatch(/[{}]/);
  });
});
