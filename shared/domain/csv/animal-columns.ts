import type { AnimalSummary } from '../../schemas/animals';
import { animalImportRow, type AnimalImportValues } from '../../schemas/import';
import {
  CAUTION_LABEL,
  CAUTIONS,
  type AnimalGroup,
  type Caution,
  type LifeStage,
  type Sex,
} from '../animal-facts';
import {
  genusGroup,
  readDate,
  readGroup,
  readNumber,
  readSex,
  readSize,
  readStage,
  readYes,
  type CellRead,
  type DateOrder,
  type SizeInputUnit,
} from '../import/cell-readers';
import { placeName } from '../places';

/**
 * The animal spreadsheet's columns, in order: what an export writes and an import reads. Lists
 * (cautions) are separated by ";" inside one cell; yes/no for the water dish.
 */
export const ANIMAL_COLUMNS = [
  'code',
  'name',
  'scientific_name',
  'common_name',
  'group',
  'stage',
  'sex',
  'size_mm',
  'acquired_on',
  'source',
  'room',
  'rack',
  'shelf',
  'position',
  'place',
  'interval_days',
  'prey_type',
  'prey_size',
  'prey_count',
  'diet',
  'water_dish',
  'do_not_feed_until',
  'mist_every_days',
  'moisten_every_days',
  'spot_clean_every_days',
  'enclosure_length_mm',
  'enclosure_width_mm',
  'enclosure_height_mm',
  'cautions',
  'caution_note',
  'clutch',
  'notes',
  'status',
  'status_date',
] as const;
export type AnimalColumn = (typeof ANIMAL_COLUMNS)[number];
/**
 * Columns an import needs; the rest may be missing. A group and a stage are needed too, but they
 * can come from a choice for every row (and the group from a genus we know).
 */
export const REQUIRED_COLUMNS: readonly AnimalColumn[] = ['name', 'scientific_name'];

/** Our columns as the import screen names them to people. */
export const COLUMN_LABEL: Record<AnimalColumn, string> = {
  code: 'Label code',
  name: 'Name',
  scientific_name: 'Species (scientific name)',
  common_name: 'Common name',
  group: 'Group',
  stage: 'Life stage',
  sex: 'Sex',
  size_mm: 'Size',
  acquired_on: 'Acquired on',
  source: 'Source (where from)',
  room: 'Room',
  rack: 'Rack',
  shelf: 'Shelf',
  position: 'Position',
  interval_days: 'Feed every (days)',
  prey_type: 'Prey',
  prey_size: 'Prey size',
  prey_count: 'Prey per feed',
  diet: 'Diet',
  water_dish: 'Water dish (yes or no)',
  do_not_feed_until: 'Do not feed until',
  mist_every_days: 'Mist every (days)',
  moisten_every_days: 'Moisten substrate every (days)',
  spot_clean_every_days: 'Spot-clean every (days)',
  enclosure_length_mm: 'Enclosure length (mm)',
  enclosure_width_mm: 'Enclosure width (mm)',
  enclosure_height_mm: 'Enclosure height (mm)',
  cautions: 'Cautions',
  caution_note: 'Caution note',
  clutch: 'Clutch',
  notes: 'Notes',
  status: 'Status',
  status_date: 'Status date',
  place: 'Place',
};
/**
 * Written by an export for the record; an import leaves them (retire animals on their page; the
 * place is read from room, rack, shelf and position).
 */
const EXPORT_ONLY: readonly AnimalColumn[] = ['place', 'status', 'status_date'];
export const IMPORT_COLUMNS = ANIMAL_COLUMNS.filter((c) => !EXPORT_ONLY.includes(c));

const text = (v: string | null | undefined) => v ?? '';
const num = (v: number | null | undefined) => (v === null || v === undefined ? '' : String(v));

/** One animal as a spreadsheet row. */
export function animalToRow(a: AnimalSummary): Record<AnimalColumn, string> {
  return {
    code: a.labelCode,
    name: a.name,
    scientific_name: a.scientificName,
    common_name: text(a.commonName),
    group: a.group,
    stage: a.lifeStage,
    sex: a.sex,
    size_mm: num(a.sizeMm),
    acquired_on: text(a.acquiredOn),
    source: text(a.source),
    room: text(a.location?.room),
    rack: text(a.location?.rack),
    shelf: text(a.location?.shelf),
    position: text(a.location?.position),
    // The place as every screen writes it; the four columns before it are what an import reads.
    place: a.location ? placeName(a.location) : '',
    interval_days: num(a.intervalDays),
    prey_type: text(a.preyType),
    prey_size: text(a.preySize),
    prey_count: num(a.preyCount),
    diet: text(a.diet),
    water_dish: a.hasWaterDish ? 'yes' : 'no',
    do_not_feed_until: text(a.doNotFeedUntil),
    mist_every_days: num(a.mistEveryDays),
    moisten_every_days: num(a.moistenEveryDays),
    spot_clean_every_days: num(a.spotCleanEveryDays),
    enclosure_length_mm: num(a.enclosureLengthMm),
    enclosure_width_mm: num(a.enclosureWidthMm),
    enclosure_height_mm: num(a.enclosureHeightMm),
    cautions: a.cautions.join(';'),
    caution_note: text(a.cautionNote),
    clutch: text(a.clutch),
    notes: text(a.notes),
    status: a.status,
    status_date: text(a.statusDate),
  };
}

/** Header cells as people write them ("Scientific name", "SIZE (mm)", "DLS inches") matched to our columns. */
export function guessColumn(header: string): AnimalColumn | null {
  const label = header.trim().toLowerCase();
  const byLabel = IMPORT_COLUMNS.find((c) => COLUMN_LABEL[c].toLowerCase() === label);
  if (byLabel) return byLabel;
  const key = label
    .replace(/\(.*?\)/g, '')
    .replace(/[^a-z]+/g, '_')
    .replace(/^_|_$/g, '');
  if ((ANIMAL_COLUMNS as readonly string[]).includes(key)) return key as AnimalColumn;
  const aliases: Record<string, AnimalColumn> = {
    label: 'code',
    label_code: 'code',
    id: 'code',
    tag: 'code',
    nickname: 'name',
    pet_name: 'name',
    species: 'scientific_name',
    latin_name: 'scientific_name',
    latin: 'scientific_name',
    scientific: 'scientific_name',
    genus_species: 'scientific_name',
    taxon: 'scientific_name',
    common: 'common_name',
    life_stage: 'stage',
    gender: 'sex',
    size: 'size_mm',
    leg_span: 'size_mm',
    legspan: 'size_mm',
    dls: 'size_mm',
    body_length: 'size_mm',
    acquired: 'acquired_on',
    date_acquired: 'acquired_on',
    acquired_date: 'acquired_on',
    bought: 'acquired_on',
    bought_on: 'acquired_on',
    date_bought: 'acquired_on',
    purchased: 'acquired_on',
    purchase_date: 'acquired_on',
    from: 'source',
    bought_from: 'source',
    breeder: 'source',
    seller: 'source',
    interval: 'interval_days',
    feed_every: 'interval_days',
    prey: 'prey_type',
    food: 'prey_type',
    water: 'water_dish',
    caution: 'cautions',
    warning: 'cautions',
    warnings: 'cautions',
    note: 'notes',
    comment: 'notes',
    comments: 'notes',
    tray: 'shelf',
    slot: 'position',
    spot: 'position',
  };
  // A unit after the name ("size_in", "dls_inches") says how to read the numbers, not which column.
  return aliases[key] ?? aliases[key.replace(/_(mm|cm|in|inch|inches)$/, '')] ?? null;
}

/** What a cell says about cautions: our words, their labels or codes, separated by ";" or ",". */
function cautionsOf(v: string | undefined): CellRead<Caution[]> {
  const byWord = new Map<string, Caution>(
    CAUTIONS.flatMap((c) => [
      [c, c],
      [CAUTION_LABEL[c].toLowerCase().replace(/[\s-]+/g, '_'), c],
    ]),
  );
  const words = (v ?? '')
    .split(/[;,]/)
    .map((w) =>
      w
        .trim()
        .toLowerCase()
        .replace(/[\s-]+/g, '_'),
    )
    .filter(Boolean);
  const unknown = words.filter((w) => !byWord.has(w));
  return unknown.length
    ? {
        ok: false,
        problem: `“${unknown[0]!.replace(/_/g, ' ')}” is not a caution we know: use ${CAUTIONS.map((c) => CAUTION_LABEL[c].toLowerCase()).join(', ')}.`,
      }
    : { ok: true, value: [...new Set(words.map((w) => byWord.get(w)!))] };
}

export type RowResult = { ok: true; value: AnimalImportValues } | { ok: false; errors: string[] };

/** How cells that need a choice are read: the same for every row of a file. */
export interface RowChoices {
  /** Day and month written as numbers before the year (03/04/2025): which comes first. */
  dateOrder?: DateOrder | null;
  /** The unit of a size written as a bare number. */
  sizeUnit?: SizeInputUnit;
  /** For rows whose cell is blank or whose file has no such column. */
  defaults?: { group?: AnimalGroup | null; stage?: LifeStage | null; sex?: Sex };
}

/**
 * One spreadsheet row, by our column names, read the way keepers write (see cell-readers.ts) and
 * checked with the same rules as the animal form. Every problem in the row is reported, each
 * starting with the column's plain name.
 */
export function rowToAnimal(
  cells: Partial<Record<AnimalColumn, string>>,
  choices: RowChoices = {},
): RowResult {
  const problems = new Map<AnimalColumn, string>();
  function read<T>(column: AnimalColumn, result: CellRead<T>, fallback: T): T {
    if (result.ok) return result.value;
    problems.set(column, result.problem);
    return fallback;
  }
  const cell = (c: AnimalColumn) => cells[c] ?? '';
  const blank = (c: AnimalColumn) => cell(c).trim() === '';
  const optional = (c: AnimalColumn) => (blank(c) ? null : cell(c).trim());
  const scientificName = cell('scientific_name');
  const group =
    read('group', readGroup(cell('group')), null) ??
    (problems.has('group') ? null : (genusGroup(scientificName) ?? null)) ??
    choices.defaults?.group ??
    null;
  if (!group && !problems.has('group'))
    problems.set(
      'group',
      scientificName.trim()
        ? `none given, and “${scientificName.trim().split(/\s+/)[0]}” is not a genus we know. Choose a group above for the rows that don’t say.`
        : 'none given. Choose a group above for the rows that don’t say.',
    );
  const lifeStage =
    read('stage', readStage(cell('stage')), null) ?? choices.defaults?.stage ?? null;
  if (!lifeStage && !problems.has('stage'))
    problems.set('stage', 'none given. Choose one above for the rows that don’t say.');
  const sex = blank('sex')
    ? (choices.defaults?.sex ?? 'unknown')
    : read('sex', readSex(cell('sex')), 'unknown');
  const place = [cells.room, cells.rack, cells.shelf, cells.position];
  const candidate = {
    labelCode: cell('code'),
    name: cell('name'),
    scientificName,
    commonName: cell('common_name'),
    // Placeholders where a problem is already noted, so the schema reports only the others.
    group: group ?? 'other',
    lifeStage: lifeStage ?? 'adult',
    sex,
    sizeMm: read('size_mm', readSize(cell('size_mm'), choices.sizeUnit ?? 'mm'), null),
    acquiredOn: read('acquired_on', readDate(cell('acquired_on'), choices.dateOrder ?? null), null),
    source: cell('source'),
    place: place.every((p) => (p ?? '').trim() === '')
      ? null
      : {
          room: cell('room'),
          rack: cell('rack'),
          shelf: cell('shelf'),
          position: cell('position'),
        },
    cautions: read('cautions', cautionsOf(cells.cautions), []),
    cautionNote: cell('caution_note'),
    notes: cell('notes'),
    clutch: cell('clutch'),
    care: {
      intervalDays: read('interval_days', readNumber(cell('interval_days')), null),
      preyType: optional('prey_type'),
      preySize: optional('prey_size'),
      preyCount: read('prey_count', readNumber(cell('prey_count')), null),
      diet: blank('diet')
        ? null
        : cell('diet')
            .trim()
            .toLowerCase()
            .replace(/[\s-]+/g, '_'),
      hasWaterDish: readYes(cell('water_dish')),
      doNotFeedUntil: read(
        'do_not_feed_until',
        readDate(cell('do_not_feed_until'), choices.dateOrder ?? null),
        null,
      ),
      mistEveryDays: read('mist_every_days', readNumber(cell('mist_every_days')), null),
      moistenEveryDays: read('moisten_every_days', readNumber(cell('moisten_every_days')), null),
      spotCleanEveryDays: read(
        'spot_clean_every_days',
        readNumber(cell('spot_clean_every_days')),
        null,
      ),
      enclosureLengthMm: read('enclosure_length_mm', readNumber(cell('enclosure_length_mm')), null),
      enclosureWidthMm: read('enclosure_width_mm', readNumber(cell('enclosure_width_mm')), null),
      enclosureHeightMm: read('enclosure_height_mm', readNumber(cell('enclosure_height_mm')), null),
    },
  };
  const parsed = animalImportRow.safeParse(candidate);
  if (parsed.success && problems.size === 0) return { ok: true, value: parsed.data };
  const others: string[] = [];
  for (const issue of parsed.success ? [] : parsed.error.issues) {
    const column = COLUMN_OF_PATH[issue.path.join('.')];
    if (!column) others.push(issue.message);
    else if (!problems.has(column)) problems.set(column, issue.message);
  }
  return {
    ok: false,
    errors: [
      ...ANIMAL_COLUMNS.filter((c) => problems.has(c)).map(
        (c) => `${COLUMN_LABEL[c]}: ${problems.get(c)}`,
      ),
      ...others,
    ],
  };
}

/** Error paths named by the spreadsheet column the keeper sees. */
const COLUMN_OF_PATH: Record<string, AnimalColumn> = {
  labelCode: 'code',
  name: 'name',
  scientificName: 'scientific_name',
  commonName: 'common_name',
  group: 'group',
  lifeStage: 'stage',
  sex: 'sex',
  sizeMm: 'size_mm',
  acquiredOn: 'acquired_on',
  source: 'source',
  'place.room': 'room',
  'place.rack': 'rack',
  'place.shelf': 'shelf',
  'place.position': 'position',
  cautions: 'cautions',
  'care.intervalDays': 'interval_days',
  'care.preyType': 'prey_type',
  'care.preySize': 'prey_size',
  'care.preyCount': 'prey_count',
  'care.diet': 'diet',
  'care.doNotFeedUntil': 'do_not_feed_until',
  'care.mistEveryDays': 'mist_every_days',
  'care.moistenEveryDays': 'moisten_every_days',
  'care.spotCleanEveryDays': 'spot_clean_every_days',
  'care.enclosureLengthMm': 'enclosure_length_mm',
  'care.enclosureWidthMm': 'enclosure_width_mm',
  'care.enclosureHeightMm': 'enclosure_height_mm',
  cautionNote: 'caution_note',
  clutch: 'clutch',
  notes: 'notes',
};
