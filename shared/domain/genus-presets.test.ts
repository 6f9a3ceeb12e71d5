// docs/care-rules.md § Genus presets: which genus belongs where is common practice, from memory;
// the caution's effects are sourced in the preset (Fuchs et al. 2014; Blaikie et al. 1997).
import { describe, expect, it } from 'vitest';
import { GENUS_PRESETS, presetFor } from './genus-presets';

describe('genus presets', () => {
  it('offers potent venom for Old World tarantula genera and urticating hairs for New World ones', () => {
    expect(presetFor('Omothymus schioedtei')).toMatchObject({
      group: 'tarantula',
      cautions: ['potent_venom', 'fast_defensive'],
    });
    expect(presetFor('Harpactira pulchripes')!.source).toMatch(/Fuchs et al/);
    expect(presetFor('Theraphosa stirmi')).toMatchObject({
      group: 'tarantula',
      cautions: ['urticating_hairs'],
    });
    expect(presetFor('Grammostola pulchra Mello-Leitão, 1921')!.genus).toBe('Grammostola');
  });
  it('knows the demo’s centipede, scorpion and mantis genera', () => {
    expect(presetFor('Scolopendra heros')).toMatchObject({
      group: 'centipede',
      cautions: ['potent_venom', 'fast_defensive', 'escape_risk'],
    });
    expect(presetFor('Heterometrus spinifer')).toMatchObject({
      group: 'scorpion',
      cautions: ['sting'],
    });
    expect(presetFor('Hierodula membranacea')).toMatchObject({ group: 'mantis', cautions: [] });
  });
  it('offers nothing for an unknown or mis-capitalised genus, and lists each genus once with a source', () => {
    expect(presetFor('Arion ater')).toBeNull();
    expect(presetFor('omothymus schioedtei')).toBeNull(); // the form's name check corrects the case first
    const genera = GENUS_PRESETS.map((p) => p.genus);
    expect(new Set(genera).size).toBe(genera.length);
    for (const p of GENUS_PRESETS) expect(p.source, p.genus).toMatch(/common practice/);
  });
});
