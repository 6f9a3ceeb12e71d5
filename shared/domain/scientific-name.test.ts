import { describe, expect, it } from 'vitest';
import { checkScientificName, latinise } from './scientific-name';

// Rules from the International Code of Zoological Nomenclature, 4th edition (1999), cited by
// article. Names are the demo scenario's species or the Code's own examples; authorships of the
// scenario's species are from memory.
describe('scientific names (ICZN 4th ed.)', () => {
  it('accepts a binomen, genus capitalised and species in lower case (Art. 5.1, 28)', () => {
    expect(checkScientificName('Tliltocatl albopilosus')).toMatchObject({
      ok: true,
      parts: { genus: 'Tliltocatl', species: 'albopilosus', authorship: null },
    });
    // The Code's example in Art. 51.2.1, "Cancer pagurus Linnaeus", with its year.
    expect(checkScientificName('Cancer pagurus Linnaeus, 1758').ok).toBe(true);
  });

  it('accepts a subgenus in parentheses between genus and species (Art. 6.1)', () => {
    // Art. 6.1 gives the form but no example name, and no demo species has a subgenus: the form itself.
    expect(checkScientificName('Genus (Subgenus) species')).toMatchObject({
      ok: true,
      parts: { genus: 'Genus', subgenus: 'Subgenus', species: 'species' },
    });
  });

  it('accepts author and year in parentheses for a species now in another genus (Art. 51.3)', () => {
    expect(checkScientificName('Arion ater (Linnaeus, 1758)')).toMatchObject({
      ok: true,
      parts: { authorship: '(Linnaeus, 1758)' },
    });
    expect(checkScientificName('Caribena versicolor (Walckenaer, 1837)').ok).toBe(true);
  });

  it('lets an author’s name keep its diacritics and hyphen (Rec. 51B) while the name may not', () => {
    expect(checkScientificName('Grammostola pulchra Mello-Leitão, 1921')).toMatchObject({
      ok: true,
      parts: { authorship: 'Mello-Leitão, 1921' },
    });
    expect(checkScientificName('Monocentropus balfouri Pocock, 1897').ok).toBe(true);
    expect(checkScientificName('Theraphosa stirmi Rudloff & Weinmann, 2010').ok).toBe(true);
  });

  it('offers the Latin-letter spelling when diacritics, hyphens or digits appear (Art. 11.2, 32.5.2)', () => {
    const accented = checkScientificName('Grammostola pulchrà');
    expect(accented.ok).toBe(false);
    expect(accented.suggestion).toBe('Grammostola pulchra');
    // Art. 32.5.2.3: a hyphen in a species-group name is deleted ("albo-pilosus" written for albopilosus).
    expect(checkScientificName('Tliltocatl albo-pilosus').suggestion).toBe(
      'Tliltocatl albopilosus',
    );
    expect(checkScientificName('Aphonopelma chalcodes2').problems[0]).toMatch(/26 Latin letters/);
    expect(latinise('Müller')).toBe('Muller');
  });

  it('corrects capitals: genus capitalised, species lower case even after a person (Art. 28)', () => {
    const check = checkScientificName('monocentropus Balfouri');
    expect(check.ok).toBe(false);
    expect(check.problems).toHaveLength(2);
    expect(check.suggestion).toBe('Monocentropus balfouri');
    expect(checkScientificName('Acanthoscurria geniculata (C. L. Koch, 1841)').ok).toBe(true);
  });

  it('refuses one word, and an authorship that is not "Author, year"', () => {
    expect(checkScientificName('Monocentropus').problems[0]).toMatch(/two parts/);
    expect(checkScientificName('').ok).toBe(false);
    expect(checkScientificName('Monocentropus balfouri Pocock 1897 maybe').ok).toBe(false);
  });

  it('accepts a trinomen (Art. 5.2) and an undescribed "sp." with a trade name', () => {
    // The Code's example of a nominotypical subspecies in Art. 47.2.
    expect(checkScientificName('Pseudoneptis bugandensis bugandensis').parts?.subspecies).toBe(
      'bugandensis',
    );
    // An invented trade name on a demo genus.
    expect(checkScientificName('Davus sp. northlight')).toMatchObject({
      ok: true,
      parts: { species: 'sp.', authorship: 'northlight' },
    });
    expect(checkScientificName('davus sp. northlight').suggestion).toBe('Davus sp. northlight');
  });
});
