import { describe, expect, it } from 'vitest';
import { checkScientificName, latinise } from './scientific-name';

// Examples from the International Code of Zoological Nomenclature, 4th edition (1999), cited by
// article; where the Code's own example is not to hand the name is marked "from memory".
describe('scientific names (ICZN 4th ed.)', () => {
  it('accepts a binomen, genus capitalised and species in lower case (Art. 5.1, 28)', () => {
    expect(checkScientificName('Tliltocatl albopilosus')).toMatchObject({ ok: true, parts: { genus: 'Tliltocatl', species: 'albopilosus', authorship: null } });
    // Art. 5.1's own example of a binomen, with its author and date (from memory).
    expect(checkScientificName('Cancer pagurus Linnaeus, 1758').ok).toBe(true);
  });

  it('accepts a subgenus in parentheses between genus and species (Art. 6.1)', () => {
    // A subgenus written as the Code shows it, e.g. Tipula (Lunatipula) (from memory).
    expect(checkScientificName('Tipula (Lunatipula) lunata')).toMatchObject({ ok: true, parts: { genus: 'Tipula', subgenus: 'Lunatipula', species: 'lunata' } });
  });

  it('accepts author and year in parentheses for a species now in another genus (Art. 51.3)', () => {
    expect(checkScientificName('Arion ater (Linnaeus, 1758)')).toMatchObject({ ok: true, parts: { authorship: '(Linnaeus, 1758)' } });
    expect(checkScientificName('Caribena versicolor (Walckenaer, 1837)').ok).toBe(true);
  });

  it('lets an author’s name keep its diacritics and hyphen (Rec. 51B) while the name may not', () => {
    expect(checkScientificName('Grammostola pulchra Mello-Leitão, 1921')).toMatchObject({ ok: true, parts: { authorship: 'Mello-Leitão, 1921' } });
    expect(checkScientificName('Poecilotheria metallica Pocock, 1899').ok).toBe(true);
    expect(checkScientificName('Euathlus condorito Perafán & Pérez-Miles, 2014').ok).toBe(true);
  });

  it('offers the Latin-letter spelling when diacritics, hyphens or digits appear (Art. 11.2, 32.5.2)', () => {
    const accented = checkScientificName('Grammostola pulchrà');
    expect(accented.ok).toBe(false);
    expect(accented.suggestion).toBe('Grammostola pulchra');
    // Art. 32.5.2.3: a hyphen in a species-group name is deleted (e.g. "rosea-maculata").
    expect(checkScientificName('Psalmopoeus rosea-maculata').suggestion).toBe('Psalmopoeus roseamaculata');
    expect(checkScientificName('Aphonopelma chalcodes2').problems[0]).toMatch(/26 Latin letters/);
    expect(latinise('Müller')).toBe('Muller');
  });

  it('corrects capitals: genus capitalised, species lower case even after a person (Art. 28)', () => {
    const check = checkScientificName('brachypelma Hamorii');
    expect(check.ok).toBe(false);
    expect(check.problems).toHaveLength(2);
    expect(check.suggestion).toBe('Brachypelma hamorii');
    expect(checkScientificName('Brachypelma smithi (F. O. Pickard-Cambridge, 1897)').ok).toBe(true);
  });

  it('refuses one word, and an authorship that is not "Author, year"', () => {
    expect(checkScientificName('Brachypelma').problems[0]).toMatch(/two parts/);
    expect(checkScientificName('').ok).toBe(false);
    expect(checkScientificName('Brachypelma hamorii Tesmoingt 1997 maybe').ok).toBe(false);
  });

  it('accepts a trinomen (Art. 5.2) and an undescribed "sp." with a trade name', () => {
    expect(checkScientificName('Pandinus imperator imperator').parts?.subspecies).toBe('imperator');
    expect(checkScientificName('Pamphobeteus sp. machala')).toMatchObject({ ok: true, parts: { species: 'sp.', authorship: 'machala' } });
    expect(checkScientificName('pamphobeteus sp. machala').suggestion).toBe('Pamphobeteus sp. machala');
  });
});
