// R13 offer and R19 prey size (docs/care-rules.md § R13, § R19, § Feeder catalogue).
// "Prey no longer than the body" is common practice with no published source; a body of about a
// third to half of a spider's leg span (0.33 taken) and the catalogue lengths are from memory.
import { describe, expect, it } from 'vitest';
import { bodyLengthMm, DEFAULT_FEEDERS, pickFeeder, type Feeder } from './feeders';
import { offerFor, type OfferAnimal } from './offer';
import { DEFAULT_RULES, effectiveRules } from './rules';

const spider = (over: Partial<OfferAnimal> = {}): OfferAnimal => ({
  group: 'tarantula',
  lifeStage: 'adult',
  sizeMm: 120,
  preyType: null,
  preySize: null,
  preyCount: null,
  ...over,
});

describe('body length (R19)', () => {
  it('takes a third of a spider’s leg span and the measured length of anything else', () => {
    expect(bodyLengthMm({ group: 'tarantula', sizeMm: 120 }, 0.33)).toBeCloseTo(39.6);
    expect(bodyLengthMm({ group: 'true_spider', sizeMm: 30 }, 0.33)).toBeCloseTo(9.9);
    expect(bodyLengthMm({ group: 'mantis', sizeMm: 90 }, 0.33)).toBe(90);
    expect(bodyLengthMm({ group: 'centipede', sizeMm: null }, 0.33)).toBeNull();
  });
});

describe('picking from the feeder catalogue (R19)', () => {
  it('takes the largest size of the wanted type no longer than the body', () => {
    expect(pickFeeder(DEFAULT_FEEDERS, 'cricket', 39.6)).toMatchObject({
      preySize: 'large',
      lengthMm: 22,
    });
    expect(pickFeeder(DEFAULT_FEEDERS, 'cricket', 13.2)).toMatchObject({
      preySize: 'small',
      lengthMm: 8,
    });
    expect(pickFeeder(DEFAULT_FEEDERS, 'roach', 40)).toMatchObject({
      preySize: 'adult',
      lengthMm: 40,
    }); // "no longer than": equal fits
  });
  it('switches type when none of the wanted type fits, unless the type is the keeper’s own', () => {
    const catalogue: Feeder[] = [
      { preyType: 'cricket', preySize: 'small', lengthMm: 8 },
      { preyType: 'fruit flies', preySize: 'flightless', lengthMm: 3 },
    ];
    expect(pickFeeder(catalogue, 'cricket', 5)).toMatchObject({ preyType: 'fruit flies' });
    expect(pickFeeder(catalogue, 'cricket', 5, false)).toMatchObject({
      preyType: 'cricket',
      preySize: 'small',
    }); // the smallest of its own type
    expect(pickFeeder(catalogue, 'superworm', 50)).toBeNull(); // not in the catalogue: the stage's own size stands
    expect(pickFeeder([], 'cricket', 50)).toBeNull();
  });
});

describe('the offer (R13, R19)', () => {
  it('sizes the stage’s prey to the animal’s body', () => {
    expect(offerFor(spider(), DEFAULT_RULES)).toEqual({
      preyType: 'cricket',
      preySize: 'large',
      countMin: 1,
      countMax: 3,
    });
    // A 16 cm giant centipede gets adult roaches (R13 stage type: roach), a mantis nymph fruit flies.
    expect(offerFor({ ...spider(), group: 'centipede', sizeMm: 160 }, DEFAULT_RULES)).toMatchObject(
      { preyType: 'roach', preySize: 'adult' },
    );
    expect(
      offerFor({ ...spider(), group: 'mantis', lifeStage: 'sling', sizeMm: 8 }, DEFAULT_RULES),
    ).toMatchObject({ preyType: 'fruit flies', preySize: 'flightless' });
    // Not "1–3 large crickets" for everyone: a 60 mm juvenile (body 19.8 mm) gets medium, a 30 mm one small.
    expect(offerFor(spider({ lifeStage: 'juvenile', sizeMm: 60 }), DEFAULT_RULES)).toMatchObject({
      preyType: 'cricket',
      preySize: 'medium',
    });
    expect(offerFor(spider({ lifeStage: 'juvenile', sizeMm: 30 }), DEFAULT_RULES)).toMatchObject({
      preyType: 'cricket',
      preySize: 'small',
    });
  });
  it('gives the tiniest tarantula slings fruit-fly larvae (R13: under 15 mm leg span)', () => {
    expect(offerFor(spider({ lifeStage: 'sling', sizeMm: 10 }), DEFAULT_RULES)).toEqual({
      preyType: 'fruit-fly larvae',
      preySize: 'tiny',
      countMin: 1,
      countMax: 1,
    });
    expect(offerFor(spider({ lifeStage: 'sling', sizeMm: 20 }), DEFAULT_RULES)).toMatchObject({
      preyType: 'cricket',
      preySize: 'pinhead',
    });
  });
  it('keeps the stage’s default size when the animal’s size is unknown', () => {
    expect(offerFor(spider({ lifeStage: 'subadult', sizeMm: null }), DEFAULT_RULES)).toEqual({
      preyType: 'cricket',
      preySize: 'medium',
      countMin: 1,
      countMax: 2,
    });
  });
  it('puts the animal’s own settings first', () => {
    expect(
      offerFor(spider({ preyType: 'roach', preySize: 'adult', preyCount: 2 }), DEFAULT_RULES),
    ).toEqual({ preyType: 'roach', preySize: 'adult', countMin: 2, countMax: 2 });
    // Own type, no size: its largest size that fits (a 39.6 mm body: large nymph, not the 40 mm adult).
    expect(offerFor(spider({ preyType: 'roach' }), DEFAULT_RULES)).toMatchObject({
      preyType: 'roach',
      preySize: 'large nymph',
    });
    expect(offerFor(spider({ preyType: 'superworm' }), DEFAULT_RULES)).toMatchObject({
      preyType: 'superworm',
      preySize: 'large',
    });
  });
  it('follows the collection’s own catalogue and body share', () => {
    const rules = effectiveRules({
      feeders: [{ preyType: 'cricket', preySize: 'XL', lengthMm: 30 }],
      spanToBody: 0.5,
    });
    expect(offerFor(spider(), rules)).toMatchObject({ preyType: 'cricket', preySize: 'XL' }); // body 60 mm
  });
  it('offers a diet’s own food, not prey, for fruit and plant eaters', () => {
    expect(offerFor({ ...spider(), group: 'beetle', diet: null }, DEFAULT_RULES)).toEqual({
      preyType: 'fruit or jelly',
      preySize: 'fresh',
      countMin: 1,
      countMax: 1,
    });
    expect(offerFor({ ...spider(), group: 'other', diet: 'plant' }, DEFAULT_RULES)).toMatchObject({
      preyType: 'plant food',
    });
  });
});
