import { describe, expect, it } from 'vitest';
import { EVENT_KINDS } from './event-kinds';
import { UNDO_EFFECTS, undoNeedsConfirmation } from './undo';

// America/Toronto is UTC−5 in December (IANA tz database).
const ZONE = 'America/Toronto';

describe('undoNeedsConfirmation', () => {
  const now = new Date('2026-12-03T15:00:00Z'); // 10:00 on Thu 3 Dec in Toronto

  it('lets a fact from today go with one tap, from its first minute', () => {
    expect(undoNeedsConfirmation('2026-12-03T14:59:00Z', now, ZONE)).toBe(false);
    expect(undoNeedsConfirmation('2026-12-03T05:00:00Z', now, ZONE)).toBe(false); // 00:00 local
  });

  it('asks first for anything from an earlier day, even a minute before local midnight', () => {
    expect(undoNeedsConfirmation('2026-12-03T04:59:00Z', now, ZONE)).toBe(true); // 23:59 on the 2nd
    expect(undoNeedsConfirmation('2026-10-01T12:00:00Z', now, ZONE)).toBe(true); // two months old
  });

  it('reads the day in the collection’s zone, not UTC', () => {
    // 01:00 UTC on the 4th is still 20:00 on the 3rd in Toronto.
    const evening = new Date('2026-12-04T01:00:00Z');
    expect(undoNeedsConfirmation('2026-12-03T15:00:00Z', evening, ZONE)).toBe(false);
    expect(undoNeedsConfirmation('2026-12-03T15:00:00Z', evening, 'UTC')).toBe(true);
  });
});

describe('UNDO_EFFECTS', () => {
  it('says what changes for every kind of fact that can be undone', () => {
    for (const kind of EVENT_KINDS.filter((k) => k !== 'void'))
      expect(UNDO_EFFECTS[kind as Exclude<typeof kind, 'void'>].length).toBeGreaterThan(10);
  });
});
