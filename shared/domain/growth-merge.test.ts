import { describe, expect, it } from 'vitest';
import { mergeMoltDetails } from './growth';

// One molt, one record (issue: a molt tapped on the round, completed later): details added to a
// molt are read as part of it. Our own rule, no outside source.
describe('mergeMoltDetails', () => {
  const molt = {
    id: 'm1',
    kind: 'molted',
    payload: { exuviaeKept: true },
    at: '2026-12-02T14:00:00Z',
  };
  it('lays later details over the molt, the latest winning, and drops the details events', () => {
    const merged = mergeMoltDetails([
      {
        id: 'd2',
        kind: 'molt_details',
        payload: { targetId: 'm1', sizeMm: 64 },
        at: '2026-12-03T09:00:00Z',
      },
      molt,
      {
        id: 'd1',
        kind: 'molt_details',
        payload: { targetId: 'm1', sizeMm: 60, sexFromExuviae: 'female' },
        at: '2026-12-02T15:00:00Z',
      },
      { id: 'a1', kind: 'ate', payload: {}, at: '2026-12-01T10:00:00Z' },
    ]);
    expect(merged.map((e) => e.id)).toEqual(['m1', 'a1']);
    expect(merged[0]!.payload).toEqual({ exuviaeKept: true, sizeMm: 64, sexFromExuviae: 'female' });
  });
  it('leaves a molt without details as it was', () => {
    expect(mergeMoltDetails([molt])).toEqual([molt]);
  });
});
