import type { AnimalGroup, Caution } from './animal-facts';

/**
 * Well-known genera with their group and usual cautions, offered (never forced) when a keeper
 * types a scientific name (docs/care-rules.md § Genus presets). Which genus belongs where is
 * common practice among keepers, from memory, unless `source` names a publication.
 */
export interface GenusPreset {
  genus: string;
  group: AnimalGroup;
  cautions: readonly Caution[];
  /** Why, in a few words: shown beside the offer. */
  note: string;
  source: string;
}

const OLD_WORLD = {
  group: 'tarantula',
  cautions: ['potent_venom', 'fast_defensive'],
  note: 'Old World tarantula: no urticating hairs, fast, and a bite can cause severe, delayed cramps',
  source: 'common practice, from memory; bite effects: Fuchs et al., Toxicon 77:73–77 (2014)',
} as const;

const NEW_WORLD_HAIRS = {
  group: 'tarantula',
  cautions: ['urticating_hairs'],
  note: 'New World tarantula with urticating hairs: protect your eyes',
  source: 'common practice, from memory; eye injuries: Blaikie et al., BMJ 314:1524 (1997)',
} as const;

const preset = (genus: string, base: Omit<GenusPreset, 'genus'>): GenusPreset => ({
  genus,
  ...base,
});

export const GENUS_PRESETS: readonly GenusPreset[] = [
  ...[
    'Ceratogyrus',
    'Chilobrachys',
    'Cyriopagopus',
    'Harpactira',
    'Heteroscodra',
    'Monocentropus',
    'Omothymus',
    'Poecilotheria',
    'Pterinochilus',
    'Selenocosmia',
    'Stromatopelma',
  ].map((g) => preset(g, OLD_WORLD)),
  ...[
    'Acanthoscurria',
    'Aphonopelma',
    'Brachypelma',
    'Chromatopelma',
    'Cyriocosmus',
    'Davus',
    'Grammostola',
    'Hapalopus',
    'Kochiana',
    'Lasiodora',
    'Nhandu',
    'Theraphosa',
    'Tliltocatl',
  ].map((g) => preset(g, NEW_WORLD_HAIRS)),
  ...['Avicularia', 'Caribena'].map((g) =>
    preset(g, {
      ...NEW_WORLD_HAIRS,
      cautions: ['urticating_hairs', 'fast_defensive'],
      note: 'New World tree-dwelling tarantula: hairs that irritate on contact, quick to bolt',
    }),
  ),
  ...['Neoholothele', 'Psalmopoeus', 'Tapinauchenius'].map((g) =>
    preset(g, {
      group: 'tarantula',
      cautions: ['fast_defensive'],
      note: 'New World tarantula without urticating hairs: fast, may bite',
      source: 'common practice, from memory',
    }),
  ),
  preset('Scolopendra', {
    group: 'centipede',
    cautions: ['potent_venom', 'fast_defensive', 'escape_risk'],
    note: 'Giant centipede: painful venom, fast, climbs out of gaps',
    source: 'common practice, from memory',
  }),
  ...['Heterometrus', 'Pandinus'].map((g) =>
    preset(g, {
      group: 'scorpion',
      cautions: ['sting'],
      note: 'Forest scorpion: stings, venom usually mild',
      source: 'common practice, from memory',
    }),
  ),
  ...['Androctonus', 'Centruroides', 'Leiurus', 'Parabuthus'].map((g) =>
    preset(g, {
      group: 'scorpion',
      cautions: ['sting', 'potent_venom', 'fast_defensive'],
      note: 'Buthid scorpion: medically significant venom',
      source: 'common practice, from memory',
    }),
  ),
  ...['Hierodula', 'Sphodromantis'].map((g) =>
    preset(g, {
      group: 'mantis',
      cautions: [],
      note: 'Mantis',
      source: 'common practice, from memory',
    }),
  ),
];

const BY_GENUS = new Map(GENUS_PRESETS.map((p) => [p.genus, p]));

/** The preset for a scientific name's genus (its first word, as written), if we know it. */
export function presetFor(scientificName: string): GenusPreset | null {
  const genus = scientificName.trim().split(/\s+/)[0] ?? '';
  return BY_GENUS.get(genus) ?? null;
}
