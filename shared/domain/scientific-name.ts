/**
 * The form of a scientific name, per the International Code of Zoological Nomenclature (4th ed.).
 * Only the form is checked — whether the name is valid or current is a taxonomist's question.
 *
 *   Genus (Subgenus) species subspecies Author, Year     Art. 5.1, 5.2, 6.1, 51
 *   Genus species (Author, Year)                          Art. 51.3: now in another genus
 *   Genus sp. anything                                    undescribed: common practice in the
 *                                                         hobby, no published source
 */
export interface NameParts {
  genus: string;
  subgenus: string | null;
  species: string;
  subspecies: string | null;
  authorship: string | null;
}

export interface NameCheck {
  ok: boolean;
  /** What is wrong, in words for the keeper. */
  problems: string[];
  /** The name with its form corrected, when a correction can be offered. */
  suggestion: string | null;
  parts: NameParts | null;
}

/** Art. 11.2: the name itself is in the 26 letters of the Latin alphabet. */
const LATIN = /^[A-Za-z]+$/;
const UNDESCRIBED = /^sp\.?$/i;

/**
 * A name part spelled in Latin letters only: diacritics dropped, hyphens and other marks removed
 * (Art. 32.5.2; the German umlaut rule of Art. 32.5.2.1 — ä → ae in names from German words
 * published before 1985 — needs the name's history, so it is not guessed here).
 */
export function latinise(word: string): string {
  return word
    .normalize('NFD')
    .replace(/[\u0300-\u036f]/g, '')
    .replace(/æ/g, 'ae')
    .replace(/œ/g, 'oe')
    .replace(/[^A-Za-z]/g, '');
}

const capitalised = (w: string) => w.charAt(0).toUpperCase() + w.slice(1).toLowerCase();

/** Authorship: "Linnaeus, 1758", "C. L. Koch, 1841", "(Walckenaer, 1837)", "Mello-Leitão, 1921". */
const AUTHORSHIP =
  /^(\()?([\p{Lu}][\p{L}'’. -]*(?:(?:,| &| and| et) [\p{Lu}][\p{L}'’. -]*)*),? (\d{4})(\))?$/u;

export function checkScientificName(raw: string): NameCheck {
  const text = raw.trim().replace(/\s+/g, ' ');
  const problems: string[] = [];
  if (!text)
    return {
      ok: false,
      problems: ['Enter the scientific name, e.g. Tliltocatl albopilosus.'],
      suggestion: null,
      parts: null,
    };

  // The authorship starts at the first word that opens a parenthesis after the epithet, or at
  // the first capitalised word after the epithet.
  const tokens = text.split(' ');
  let i = 0;
  const genus = tokens[i++]!;
  let subgenus: string | null = null;
  if (tokens[i]?.startsWith('(') && tokens[i]!.endsWith(')') && !/\d/.test(tokens[i]!)) {
    subgenus = tokens[i++]!.slice(1, -1);
  }
  const species = tokens[i++];
  if (!species) {
    return {
      ok: false,
      problems: [
        'A species name has two parts: the genus and the species, e.g. Tliltocatl albopilosus (ICZN Art. 5.1).',
      ],
      suggestion: null,
      parts: null,
    };
  }
  if (UNDESCRIBED.test(species)) {
    const rest = tokens.slice(i).join(' ');
    const fixedGenus = capitalised(latinise(genus));
    if (fixedGenus !== genus)
      problems.push(`The genus is written with a capital and in Latin letters: ${fixedGenus}.`);
    const suggestion = [fixedGenus, 'sp.', rest].filter(Boolean).join(' ');
    return {
      ok: problems.length === 0,
      problems,
      suggestion: problems.length ? suggestion : null,
      parts: {
        genus: fixedGenus,
        subgenus: null,
        species: 'sp.',
        subspecies: null,
        authorship: rest || null,
      },
    };
  }
  let subspecies: string | null = null;
  const next = tokens[i];
  if (
    next &&
    !next.startsWith('(') &&
    /^[\p{Ll}]/u.test(next) &&
    !/\d/.test(next) &&
    !/^(and|et|in|de|von|van|da|du)$/.test(next)
  ) {
    subspecies = tokens[i++]!;
  }
  const authorship = tokens.slice(i).join(' ') || null;

  // Art. 28: genus-group names begin with a capital letter, species-group names with a lower-case one.
  const fixed = {
    genus: capitalised(latinise(genus)),
    subgenus: subgenus === null ? null : capitalised(latinise(subgenus)),
    species: latinise(species).toLowerCase(),
    subspecies: subspecies === null ? null : latinise(subspecies).toLowerCase(),
  };
  const nameParts = [genus, subgenus, species, subspecies].filter((p): p is string => p !== null);
  if (nameParts.some((p) => !LATIN.test(p))) {
    problems.push(
      'Scientific names use the 26 Latin letters only: no accents, hyphens, digits or other marks (ICZN Art. 11.2, 32.5.2).',
    );
  }
  if (
    fixed.genus !== latinise(genus) ||
    (subgenus !== null && fixed.subgenus !== latinise(subgenus))
  ) {
    problems.push(
      'The genus (and a subgenus) starts with a capital letter, the rest in lower case (ICZN Art. 28).',
    );
  }
  if (
    fixed.species !== latinise(species) ||
    (subspecies !== null && fixed.subspecies !== latinise(subspecies))
  ) {
    problems.push(
      'The species part is all lower case, even when it honours a person or place (ICZN Art. 28).',
    );
  }
  if (!fixed.genus || !fixed.species) problems.push('The genus and the species each need letters.');
  if (authorship !== null && !AUTHORSHIP.test(authorship)) {
    problems.push(
      'Write the author and year as “Author, 1758”, or “(Author, 1758)” when the species now sits in another genus (ICZN Art. 51.3).',
    );
  }
  const suggestionText = [
    fixed.genus,
    fixed.subgenus ? `(${fixed.subgenus})` : null,
    fixed.species,
    fixed.subspecies,
    authorship,
  ]
    .filter(Boolean)
    .join(' ');
  return {
    ok: problems.length === 0,
    problems,
    suggestion: problems.length && suggestionText !== text ? suggestionText : null,
    parts: { ...fixed, authorship },
  };
}
