import type { ShippingConcern } from './shipping-check';

/**
 * The packing checklist for live invertebrates. Common practice, no published source: what
 * breeders who ship slings and adults commonly do. Carriers' and countries' own rules for live
 * animals come first; this list does not replace them.
 */
export const PACKING_ITEMS = [
  {
    key: 'container',
    words: 'A ventilated deli cup or vial sized to the animal (it can turn, not tumble)',
  },
  {
    key: 'padding',
    words: 'Padding inside the cup (damp-free paper or moss) so the animal cannot roll',
  },
  { key: 'insulated_box', words: 'An insulated box, with packing so the cups cannot move' },
  { key: 'heat_pack', words: 'A heat pack, taped away from the cups, for a cold route' },
  { key: 'cold_pack', words: 'A cold pack, wrapped, away from the cups, for a hot route' },
  { key: 'label_live', words: 'A "live animals" label where the carrier allows it' },
  { key: 'buyer_contact', words: "The buyer's contact details inside the box" },
  { key: 'care_sheet', words: 'A care sheet for each animal in the box' },
] as const;

export type PackingKey = (typeof PACKING_ITEMS)[number]['key'];
export const PACKING_KEYS = PACKING_ITEMS.map((i) => i.key) as PackingKey[];

export interface PackingLine {
  key: PackingKey;
  words: string;
  /** Needed on this route: a heat pack only when it is too cold, a cold pack when too hot. */
  needed: boolean;
  done: boolean;
}

/** The checklist for one parcel: the route's concerns decide the heat and cold packs. */
export function packingChecklist(
  concerns: readonly ShippingConcern[],
  ticked: Readonly<Record<string, boolean>>,
): PackingLine[] {
  const cold = concerns.some((c) => c.kind === 'too_cold');
  const hot = concerns.some((c) => c.kind === 'too_hot');
  return PACKING_ITEMS.map((item) => ({
    key: item.key,
    words: item.words,
    needed: item.key === 'heat_pack' ? cold : item.key === 'cold_pack' ? hot : true,
    done: ticked[item.key] === true,
  }));
}

/** The needed items not ticked yet, in list order. */
export function packingLeft(lines: readonly PackingLine[]): PackingKey[] {
  return lines.filter((l) => l.needed && !l.done).map((l) => l.key);
}

/** The caution shown wherever a keeper ships (issue 21, part 5). */
export const SHIPPING_CAUTION =
  'Carriers and countries have their own rules for live animals, and some species need permits to be sold or moved. Local law and the carrier’s terms come first: check them before you ship.';
