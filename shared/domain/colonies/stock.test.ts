import { describe, expect, it } from 'vitest';
import {
  applyDelta,
  countUpdateDeltas,
  drawLine,
  drawPrepList,
  preyUsed,
  shortWarning,
  wholeEstimate,
  type ColonyStock,
} from './stock';

// Worked cases for docs/care-rules.md § Feeder colonies. The arithmetic is checked by hand
// (common practice, no published source: a colony's stock is a keeper's estimate per size).

const dubiaA: ColonyStock = {
  id: 'a',
  name: 'Dubia bin A',
  preyType: 'roach',
  stock: { 'small nymph': 30, 'medium nymph': 6, adult: 40 },
};
const dubiaB: ColonyStock = {
  id: 'b',
  name: 'Dubia bin B',
  preyType: 'roach',
  stock: { 'small nymph': 12, 'medium nymph': 4 },
};
const crickets: ColonyStock = {
  id: 'c',
  name: 'Cricket bin',
  preyType: 'cricket',
  stock: { small: 3, medium: 50 },
};

describe('stock arithmetic', () => {
  it('keeps estimates whole and never below zero', () => {
    expect(wholeEstimate(12.4)).toBe(12);
    expect(wholeEstimate(12.5)).toBe(13);
    expect(wholeEstimate(-3)).toBe(0);
    expect(wholeEstimate(Number.NaN)).toBe(0);
  });

  it('clamps a take at zero and reports what really changed, so giving back is exact', () => {
    // 6 held, 10 taken: 0 left, 6 applied; giving those 6 back restores 6.
    const taken = applyDelta(6, -10);
    expect(taken).toEqual({ count: 0, applied: -6 });
    expect(applyDelta(taken.count, -taken.applied)).toEqual({ count: 6, applied: 6 });
    expect(applyDelta(40, -3)).toEqual({ count: 37, applied: -3 });
    expect(applyDelta(0, 0)).toEqual({ count: 0, applied: 0 });
  });

  it('turns a count update into per-size changes, matching the colony’s spelling', () => {
    // Held 30 small, 6 medium; seen 25 small, 6 medium, 10 large (new): −5, +10.
    expect(
      countUpdateDeltas({ 'small nymph': 30, 'medium nymph': 6 }, [
        { preySize: 'Small nymph', count: 25 },
        { preySize: 'medium nymph', count: 6 },
        { preySize: 'large nymph', count: 10 },
      ]),
    ).toEqual([
      { preySize: 'small nymph', delta: -5 },
      { preySize: 'large nymph', delta: 10 },
    ]);
  });
});

describe('the prep-list draw', () => {
  it('pulls a line from the colony of that type holding the most of that size', () => {
    // 8 small nymphs: A holds 30, B 12 → all 8 from A.
    expect(drawLine('roach', 'small nymph', 8, [dubiaB, dubiaA, crickets])).toEqual({
      need: 8,
      draws: [{ colonyId: 'a', colonyName: 'Dubia bin A', preySize: 'small nymph', count: 8 }],
      short: 0,
      kept: true,
    });
  });

  it('splits a line across colonies when the fullest is not enough', () => {
    // 9 medium nymphs: A holds 6, B 4 → 6 from A, 3 from B, none short.
    const d = drawLine('Roach', 'Medium Nymph', 9, [dubiaA, dubiaB]);
    expect(d.draws.map((x) => [x.colonyId, x.count])).toEqual([
      ['a', 6],
      ['b', 3],
    ]);
    expect(d.short).toBe(0);
  });

  it('says how many are short when all the colonies together hold too few', () => {
    // 14 medium nymphs: 6 + 4 = 10 held → 4 short.
    const [line] = drawPrepList(
      [{ preyType: 'roach', preySize: 'medium nymph', countMin: 10, countMax: 14 }],
      [dubiaA, dubiaB],
    );
    expect(line!.draw.short).toBe(4);
    expect(line!.draw.draws.map((x) => x.count)).toEqual([6, 4]);
    expect(shortWarning(line!)).toBe(
      'Needs 14 medium nymph roach; the colonies hold 10 (Dubia bin A 6, Dubia bin B 4): 4 short.',
    );
  });

  it('warns when a colony of the type exists but holds none of the size', () => {
    const [line] = drawPrepList(
      [{ preyType: 'cricket', preySize: 'large', countMin: 2, countMax: 2 }],
      [crickets],
    );
    expect(line!.draw).toEqual({ need: 2, draws: [], short: 2, kept: true });
    expect(shortWarning(line!)).toBe('Needs 2 large cricket; no colony holds any.');
  });

  it('leaves a line without a colony of its type as it was: no draw, no warning', () => {
    const [line] = drawPrepList(
      [{ preyType: 'mealworm', preySize: 'small', countMin: 1, countMax: 1 }],
      [dubiaA, crickets],
    );
    expect(line!.draw).toEqual({ need: 1, draws: [], short: 1, kept: false });
    expect(shortWarning(line!)).toBeNull();
    expect(drawPrepList([], [dubiaA])).toEqual([]);
  });

  it('breaks a tie by name so the same stock always names the same colony', () => {
    const twin = { ...dubiaB, id: 'z', name: 'Alpha tub', stock: { adult: 40 } };
    expect(drawLine('roach', 'adult', 1, [dubiaA, twin]).draws[0]!.colonyName).toBe('Alpha tub');
  });
});

describe('what an outcome takes', () => {
  const offer = { preyType: 'roach', preySize: 'small nymph', countMin: 2, countMax: 3 };
  it('takes the tap’s own prey and count first, else the offer’s lower count', () => {
    expect(preyUsed('ate', {}, offer)).toEqual({
      preyType: 'roach',
      preySize: 'small nymph',
      count: 2,
    });
    expect(preyUsed('prey_left_in', { count: 1 }, offer)!.count).toBe(1);
    expect(preyUsed('ate', { preyType: 'cricket', preySize: 'small', count: 4 }, offer)).toEqual({
      preyType: 'cricket',
      preySize: 'small',
      count: 4,
    });
  });
  it('takes nothing for other outcomes or when no prey is named', () => {
    expect(preyUsed('refused', {}, offer)).toBeNull();
    expect(preyUsed('watered', {}, offer)).toBeNull();
    expect(preyUsed('ate', {}, null)).toBeNull();
  });
});
