import { describe, expect, it } from 'vitest';
import { effectiveRules } from '../rounds/rules';
import { careSheetContent, type CareSheetAnimal, type CareSheetInput } from './care-sheet';

const sling: CareSheetAnimal = {
  name: 'Formosus 04',
  scientificName: 'Hapalopus formosus',
  commonName: 'Colombian pumpkin patch',
  group: 'tarantula',
  lifeStage: 'sling',
  sex: 'unknown',
  sizeMm: 12,
  instar: 3,
  cautions: ['urticating_hairs'],
  cautionNote: null,
  hasWaterDish: false,
  intervalDays: null,
  preyType: null,
  preySize: null,
  preyCount: null,
  diet: null,
  mistEveryDays: null,
  moistenEveryDays: null,
};

const input = (over: Partial<CareSheetInput> = {}): CareSheetInput => ({
  collectionName: 'Northlight Inverts',
  animal: sling,
  rules: effectiveRules({}),
  lastMolt: '2026-11-20',
  meals: [],
  breederNotes: '',
  issuedOn: '2026-12-03',
  ...over,
});

describe('careSheetContent', () => {
  it('names the animal, its stage, size, instar and last molt', () => {
    const sheet = careSheetContent(input());
    expect(sheet.title).toBe('Hapalopus formosus — Colombian pumpkin patch');
    expect(sheet.from).toBe('Northlight Inverts');
    expect(Object.fromEntries(sheet.facts.map((f) => [f.label, f.value]))).toEqual({
      Species: 'Hapalopus formosus',
      'Common name': 'Colombian pumpkin patch',
      Stage: 'Sling',
      Sex: 'Not known yet',
      Size: '12 mm leg span · instar 3',
      'Last molt': '20 Nov 2026',
    });
  });

  it('feeds and waters by the collection’s current rules, as the round does', () => {
    // docs/care-rules.md § R1 and § Care profiles: a tarantula sling every 3 days, a pinhead
    // cricket below the tiny-sling size 15 mm fruit-fly larvae (R13); a dishless sling under
    // 75 mm has part of its substrate moistened every 4 days (R7).
    const sheet = careSheetContent(input({ animal: { ...sling, sizeMm: 18 } }));
    expect(sheet.feeding[0]).toBe('1 × cricket (pinhead) every 3 days, offered with long tongs.');
    expect(sheet.feeding.join(' ')).toContain('no food for 4 days');
    expect(sheet.water).toEqual([
      'Moisten one corner of the substrate every 4 days, so part stays damp and part dry. No puddles.',
    ]);
    // A collection that feeds its slings every 5 days: the sheet follows.
    const changed = careSheetContent(
      input({
        animal: { ...sling, sizeMm: 18 },
        rules: effectiveRules({
          profiles: { tarantula: { stages: { sling: { feedEveryDays: 5 } } } },
        }),
      }),
    );
    expect(changed.feeding[0]).toContain('every 5 days');
    // The animal's own settings come first, as on the round.
    const own = careSheetContent(
      input({
        animal: {
          ...sling,
          intervalDays: 7,
          preyType: 'roach',
          preySize: 'nymph',
          preyCount: 2,
          hasWaterDish: true,
        },
      }),
    );
    expect(own.feeding[0]).toBe('2 × roach (nymph) every 7 days, offered with long tongs.');
    expect(own.water[0]).toBe('A shallow water dish, topped up with clean water every 3 days.');
  });

  it('lists the five newest meals, newest first', () => {
    const meals = ['01', '04', '07', '10', '13', '16', '19'].map((d) => ({
      date: `2026-11-${d}`,
      what: `meal ${d}`,
    }));
    const sheet = careSheetContent(input({ meals }));
    expect(sheet.meals.map((m) => m.what)).toEqual([
      'meal 19',
      'meal 16',
      'meal 13',
      'meal 10',
      'meal 07',
    ]);
    expect(sheet.meals[0]!.date).toBe('19 Nov 2026');
  });

  it('carries the cautions for its kind, the law-first line and the breeder’s words only', () => {
    const sheet = careSheetContent(
      input({
        animal: { ...sling, cautions: ['urticating_hairs', 'fast_defensive'] },
        breederNotes: '  Eats well; rehoused on coco fibre.  ',
      }),
    );
    expect(sheet.cautions.map((c) => c.title)).toEqual([
      'Irritating hairs — protect your eyes',
      'Fast or defensive — open slowly',
    ]);
    expect(sheet.general.join(' ')).toContain('local law and licensed practice come first');
    expect(sheet.general.join(' ')).not.toContain('call the keeper');
    expect(sheet.breederNotes).toBe('Eats well; rehoused on coco fibre.');
    expect(careSheetContent(input()).breederNotes).toBeNull();
  });

  it('says when a stage is not fed', () => {
    const sheet = careSheetContent(input({ animal: { ...sling, lifeStage: 'first_instar' } }));
    expect(sheet.feeding).toEqual(['Not fed at this stage: leave it be until its next molt.']);
    expect(sheet.water).toEqual([]);
  });
});
