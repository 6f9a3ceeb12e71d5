import { stageLabel, type AnimalGroup, type LifeStage, type Sex } from '../animal-facts';
import { writeCsv } from '../csv/csv-file';
import { formatMoney, minorToDecimal, type CurrencyCode } from './money';

/**
 * Stock for sale, grouped the way a buyer or a shop reads it: one line per species and stage,
 * with counts, sexes, sizes and prices. The public list and its CSV are built only from these
 * groups, never from animal rows, so no code, place, note or id can reach them.
 */

/** The columns a keeper may show on the public list, in the order they appear. */
export const AVAILABILITY_COLUMNS = [
  'species',
  'commonName',
  'stage',
  'sex',
  'size',
  'price',
  'count',
] as const;
export type AvailabilityColumn = (typeof AVAILABILITY_COLUMNS)[number];

export const COLUMN_LABEL: Record<AvailabilityColumn, string> = {
  species: 'Species',
  commonName: 'Common name',
  stage: 'Stage',
  sex: 'Sex',
  size: 'Size',
  price: 'Price',
  count: 'Available',
};

/**
 * An instar where we can know it: for an animal from the collection's own egg sac, 1 (the first
 * instar, in the sac) plus the molts recorded since (common practice, no published source: the
 * count starts at the first instar). For a bought-in animal, unknown.
 */
export const instarOf = (fromOwnSac: boolean, moltsRecorded: number): number | null =>
  fromOwnSac ? 1 + moltsRecorded : null;

/** One listed animal, as grouping needs it. */
export interface StockAnimal {
  scientificName: string;
  commonName: string | null;
  group: AnimalGroup;
  lifeStage: LifeStage;
  sex: Sex;
  sizeMm: number | null;
  instar: number | null;
  priceMinor: number;
  currency: CurrencyCode;
  listedPublicly: boolean;
  state: 'available' | 'reserved';
}

export interface Range {
  min: number;
  max: number;
}

export interface StockGroup {
  scientificName: string;
  commonName: string | null;
  group: AnimalGroup;
  lifeStage: LifeStage;
  available: number;
  reserved: number;
  sexes: { female: number; male: number; unknown: number };
  sizeMm: Range | null;
  instar: Range | null;
  price: { currency: CurrencyCode; min: number; max: number } | null;
}

const widen = (r: Range | null, v: number | null): Range | null =>
  v === null ? r : r ? { min: Math.min(r.min, v), max: Math.max(r.max, v) } : { min: v, max: v };

/**
 * Groups by species and stage. Sexes, sizes, instars and prices describe the animals still
 * available (a reserved sling is no longer on offer); `reserved` only counts them. A mature male
 * is a male. Species in alphabetical order, stages in life order.
 */
export function groupStock(animals: readonly StockAnimal[]): StockGroup[] {
  const groups = new Map<string, StockGroup & { currencies: Set<CurrencyCode> }>();
  for (const a of animals) {
    const key = `${a.scientificName.toLowerCase()}\u0000${a.lifeStage}`;
    let g = groups.get(key);
    if (!g) {
      g = {
        scientificName: a.scientificName,
        commonName: a.commonName,
        group: a.group,
        lifeStage: a.lifeStage,
        available: 0,
        reserved: 0,
        sexes: { female: 0, male: 0, unknown: 0 },
        sizeMm: null,
        instar: null,
        price: null,
        currencies: new Set(),
      };
      groups.set(key, g);
    }
    g.commonName ??= a.commonName;
    if (a.state === 'reserved') {
      g.reserved++;
      continue;
    }
    g.available++;
    g.sexes[a.sex === 'female' ? 'female' : a.sex === 'unknown' ? 'unknown' : 'male']++;
    g.sizeMm = widen(g.sizeMm, a.sizeMm);
    g.instar = widen(g.instar, a.instar);
    g.currencies.add(a.currency);
    const p = g.price;
    g.price =
      p && p.currency === a.currency
        ? {
            currency: p.currency,
            min: Math.min(p.min, a.priceMinor),
            max: Math.max(p.max, a.priceMinor),
          }
        : p
          ? p
          : { currency: a.currency, min: a.priceMinor, max: a.priceMinor };
  }
  const stageOrder = (s: LifeStage) =>
    ['first_instar', 'sling', 'larva', 'juvenile', 'subadult', 'pupa', 'adult'].indexOf(s);
  return [...groups.values()]
    .map(({ currencies, ...g }) => ({ ...g, price: currencies.size > 1 ? null : g.price }))
    .sort(
      (a, b) =>
        a.scientificName.localeCompare(b.scientificName, 'en') ||
        stageOrder(a.lifeStage) - stageOrder(b.lifeStage),
    );
}

const rangeWords = (r: Range, unit: string) =>
  r.min === r.max ? `${r.min}${unit}` : `${r.min}–${r.max}${unit}`;

/** "2 female · 1 male · 9 unsexed" (only the sexes present). */
export function sexWords(s: StockGroup['sexes']): string {
  return (
    [
      s.female && `${s.female} female`,
      s.male && `${s.male} male`,
      s.unknown && `${s.unknown} unsexed`,
    ]
      .filter(Boolean)
      .join(' · ') || '—'
  );
}

/** "10–14 mm leg span · instar 3–4" (leg span is what keepers measure on spiders). */
export function sizeWords(g: Pick<StockGroup, 'sizeMm' | 'instar'>): string {
  return (
    [
      g.sizeMm && `${rangeWords(g.sizeMm, ' mm')} leg span`,
      g.instar && `instar ${rangeWords(g.instar, '')}`,
    ]
      .filter(Boolean)
      .join(' · ') || '—'
  );
}

/** "CA$25.00" or "CA$20.00–CA$25.00"; `plain` gives "25.00 CAD" for spreadsheets. */
export function priceWords(
  price: StockGroup['price'],
  { plain = false, locale }: { plain?: boolean; locale?: string } = {},
): string {
  if (!price) return 'Ask';
  const one = (minor: number) =>
    plain ? minorToDecimal(minor, price.currency) : formatMoney(minor, price.currency, locale);
  const words = price.min === price.max ? one(price.min) : `${one(price.min)}–${one(price.max)}`;
  return plain ? `${words} ${price.currency}` : words;
}

interface FullRow {
  species: string;
  commonName: string;
  stage: string;
  sex: string;
  size: string;
  price: string;
  count: number;
}
export type PublicRow = Partial<FullRow>;

/**
 * The public list's rows: only animals listed publicly and available, grouped, and only the
 * chosen columns. A group with none available is left out.
 */
export function publicRows(
  animals: readonly StockAnimal[],
  columns: readonly AvailabilityColumn[],
  options: { plain?: boolean; locale?: string } = {},
): PublicRow[] {
  const shown = animals.filter((a) => a.listedPublicly && a.state === 'available');
  return groupStock(shown).map((g) => {
    const all: FullRow = {
      species: g.scientificName,
      commonName: g.commonName ?? '',
      stage: stageLabel(g.group, g.lifeStage),
      sex: sexWords(g.sexes),
      size: sizeWords(g),
      price: priceWords(g.price, options),
      count: g.available,
    };
    return Object.fromEntries(
      AVAILABILITY_COLUMNS.filter((c) => columns.includes(c)).map((c) => [c, all[c]]),
    ) as PublicRow;
  });
}

/** The list as CSV for a shop (RFC 4180 via writeCsv): a header of the chosen columns. */
export function availabilityCsv(
  animals: readonly StockAnimal[],
  columns: readonly AvailabilityColumn[],
): string {
  const chosen = AVAILABILITY_COLUMNS.filter((c) => columns.includes(c));
  const rows = publicRows(animals, chosen, { plain: true });
  return writeCsv(
    chosen.map((c) => COLUMN_LABEL[c]),
    rows.map((r) => Object.fromEntries(chosen.map((c) => [COLUMN_LABEL[c], String(r[c] ?? '')]))),
  );
}
