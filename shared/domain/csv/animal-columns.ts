import type { AnimalSummary } from '../../schemas/animals';
import { animalImportRow, type AnimalImportValues } from '../../schemas/import';
import { CAUTIONS, type Caution } from '../animal-facts';
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
  'cautions',
  'caution_note',
  'clutch',
  'notes',
  'status',
  'status_date',
] as const;
export type AnimalColumn = (typeof ANIMAL_COLUMNS)[number];
/** Columns an import needs; the rest may be missing. */
export const REQUIRED_COLUMNS: readonly AnimalColumn[] = [
  'name',
  'scientific_name',
  'group',
  'stage',
];
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
    cautions: a.cautions.join(';'),
    caution_note: text(a.cautionNote),
    clutch: text(a.clutch),
    notes: text(a.notes),
    status: a.status,
    status_date: text(a.statusDate),
  };
}

/** Header cells as people write them ("Scientific name", "SIZE (mm)") matched to our columns. */
export function guessColumn(header: string): AnimalColumn | null {
  const key = header
    .trim()
    .toLowerCase()
    .replace(/\(.*?\)/g, '')
    .replace(/[^a-z]+/g, '_')
    .replace(/^_|_$/g, '');
  const aliases: Record<string, AnimalColumn> = {
    label: 'code',
    label_code: 'code',
    id: 'code',
    tag: 'code',
    species: 'scientific_name',
    latin_name: 'scientific_name',
    scientific: 'scientific_name',
    common: 'common_name',
    life_stage: 'stage',
    size: 'size_mm',
    leg_span: 'size_mm',
    dls: 'size_mm',
    acquired: 'acquired_on',
    bought: 'acquired_on',
    from: 'source',
    interval: 'interval_days',
    feed_every: 'interval_days',
    prey: 'prey_type',
    food: 'prey_type',
    water: 'water_dish',
    caution: 'cautions',
    warning: 'cautions',
    warnings: 'cautions',
    note: 'notes',
    comments: 'notes',
    tray: 'shelf',
    slot: 'position',
    spot: 'position',
  };
  if ((ANIMAL_COLUMNS as readonly string[]).includes(key)) return key as AnimalColumn;
  return aliases[key] ?? null;
}

const blank = (v: string | undefined) => v === undefined || v.trim() === '';
const number = (v: string | undefined) => (blank(v) ? null : Number(v!.trim().replace(',', '.')));
const yes = (v: string | undefined) => /^(y|yes|true|1|x)$/i.test(v?.trim() ?? '');

/** What a cell says about cautions: our words or codes, separated by ";" or ",". */
function cautionsOf(v: string | undefined): Caution[] | string {
  if (blank(v)) return [];
  const words = v!
    .split(/[;,]/)
    .map((w) =>
      w
        .trim()
        .toLowerCase()
        .replace(/[\s-]+/g, '_'),
    )
    .filter(Boolean);
  const unknown = words.filter((w) => !(CAUTIONS as readonly string[]).includes(w));
  return unknown.length
    ? `Unknown caution “${unknown[0]}”: use ${CAUTIONS.join(', ')}.`
    : (words as Caution[]);
}

export type RowResult = { ok: true; value: AnimalImportValues } | { ok: false; errors: string[] };

/** One spreadsheet row, by our column names, checked with the same rules as the animal form. */
export function rowToAnimal(cells: Partial<Record<AnimalColumn, string>>): RowResult {
  const cautions = cautionsOf(cells.cautions);
  if (typeof cautions === 'string') return { ok: false, errors: [cautions] };
  const place = [cells.room, cells.rack, cells.shelf, cells.position];
  const candidate = {
    labelCode: cells.code ?? '',
    name: cells.name ?? '',
    scientificName: cells.scientific_name ?? '',
    commonName: cells.common_name ?? '',
    group: (cells.group ?? '').trim().toLowerCase().replace(/\s+/g, '_'),
    lifeStage: (cells.stage ?? '').trim().toLowerCase(),
    sex: blank(cells.sex) ? 'unknown' : cells.sex!.trim().toLowerCase().replace(/\s+/g, '_'),
    sizeMm: number(cells.size_mm),
    acquiredOn: blank(cells.acquired_on) ? null : cells.acquired_on!.trim(),
    source: cells.source ?? '',
    place: place.every(blank)
      ? null
      : {
          room: cells.room ?? '',
          rack: cells.rack ?? '',
          shelf: cells.shelf ?? '',
          position: cells.position ?? '',
        },
    cautions,
    cautionNote: cells.caution_note ?? '',
    notes: cells.notes ?? '',
    clutch: cells.clutch ?? '',
    care: {
      intervalDays: number(cells.interval_days),
      preyType: blank(cells.prey_type) ? null : cells.prey_type!.trim(),
      preySize: blank(cells.prey_size) ? null : cells.prey_size!.trim(),
      preyCount: number(cells.prey_count),
      diet: blank(cells.diet)
        ? null
        : cells
            .diet!.trim()
            .toLowerCase()
            .replace(/[\s-]+/g, '_'),
      hasWaterDish: yes(cells.water_dish),
      doNotFeedUntil: blank(cells.do_not_feed_until) ? null : cells.do_not_feed_until!.trim(),
    },
  };
  const parsed = animalImportRow.safeParse(candidate);
  if (parsed.success) return { ok: true, value: parsed.data };
  return {
    ok: false,
    errors: parsed.error.issues.map(
      (i) => `${COLUMN_OF_PATH[i.path.join('.')] ?? i.path.join('.')}: ${i.message}`,
    ),
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
  'care.intervalDays': 'interval_days',
  'care.preyType': 'prey_type',
  'care.preySize': 'prey_size',
  'care.preyCount': 'prey_count',
  'care.diet': 'diet',
  'care.doNotFeedUntil': 'do_not_feed_until',
  cautionNote: 'caution_note',
  clutch: 'clutch',
  notes: 'notes',
};
