import { describe, expect, it } from 'vitest';
import { stockSeries } from './stock-series';

// Worked case, added up by hand (common practice, no published source).
describe('a colony’s stock over time', () => {
  it('carries every size forward and merges changes made at the same moment', () => {
    const t1 = '2026-12-01T09:00:00.000Z';
    const t2 = '2026-12-02T08:00:00.000Z';
    const t3 = '2026-12-03T08:00:00.000Z';
    expect(
      stockSeries([
        { at: t2, preySize: 'small nymph', after: 27 },
        { at: t1, preySize: 'small nymph', after: 30 },
        { at: t1, preySize: 'adult', after: 40 },
        { at: t3, preySize: 'adult', after: 38 },
      ]),
    ).toEqual([
      { at: t1, counts: { 'small nymph': 30, adult: 40 }, total: 70 },
      { at: t2, counts: { 'small nymph': 27, adult: 40 }, total: 67 },
      { at: t3, counts: { 'small nymph': 27, adult: 38 }, total: 65 },
    ]);
    expect(stockSeries([])).toEqual([]);
  });
});
