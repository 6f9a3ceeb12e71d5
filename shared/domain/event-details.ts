import { SEX_LABEL, STATUS_LABEL, type AnimalStatus } from './animal-facts';
import type { EventKind } from './event-kinds';

/** Names for the ids a payload may hold; an id with no name found is left out, never printed raw. */
export interface DetailNames {
  /** "Blue Jay (NL-7K3)" for an animal's id. */
  animal?: (id: string) => string | undefined;
  /** "A1-2" for a place's id. */
  place?: (id: string) => string | undefined;
}

const PAIRING_OUTCOME: Record<string, string> = {
  accepted: 'accepted',
  no_interest: 'no interest',
  incident: 'incident',
};

const n = (count: number, one: string, many: string) => `${count} ${count === 1 ? one : many}`;

/**
 * An event's payload in plain words, for the history CSV a keeper opens in a spreadsheet:
 * "2 × cricket, small · note: ate at once", not `{"count":2,"preyType":"cricket",…}`.
 * Unknown keys are skipped (the payload schema allows none; older rows may have had some).
 */
export function eventDetails(
  kind: EventKind,
  payload: Record<string, unknown>,
  names: DetailNames = {},
): string {
  const p = payload as {
    preyType?: string;
    preySize?: string;
    count?: number;
    sizeMm?: number;
    exuviaeKept?: boolean;
    sexFromExuviae?: keyof typeof SEX_LABEL;
    maturing?: boolean;
    eggCount?: number;
    maleId?: string;
    outsideMale?: string;
    outcome?: string;
    targetId?: string;
    fromLocationId?: string | null;
    toLocationId?: string;
    rehoused?: boolean;
    from?: AnimalStatus;
    to?: AnimalStatus;
    text?: string;
    note?: string;
  };
  const parts: (string | null | undefined | false)[] = [];
  if (p.preyType || p.preySize) {
    const prey = [p.preyType, p.preySize].filter(Boolean).join(', ');
    parts.push(p.count ? `${p.count} × ${prey}` : prey);
  } else if (typeof p.count === 'number') {
    parts.push(kind === 'brood_started' ? n(p.count, 'young', 'young') : `count ${p.count}`);
  }
  if (typeof p.sizeMm === 'number') parts.push(`size ${p.sizeMm} mm`);
  if (p.sexFromExuviae && p.sexFromExuviae !== 'unknown')
    parts.push(`exuviae shows ${SEX_LABEL[p.sexFromExuviae].toLowerCase()}`);
  if (p.exuviaeKept) parts.push('exuviae kept');
  if (p.maturing) parts.push('maturing');
  if (typeof p.eggCount === 'number') parts.push(n(p.eggCount, 'egg', 'eggs'));
  if (p.maleId) parts.push(`with ${names.animal?.(p.maleId) ?? 'a male of the collection'}`);
  if (p.outsideMale) parts.push(`with ${p.outsideMale} (not in the collection)`);
  if (p.outcome) parts.push(PAIRING_OUTCOME[p.outcome] ?? p.outcome);
  if (p.targetId)
    parts.push(kind === 'void' ? `undoes event ${p.targetId}` : `adds to event ${p.targetId}`);
  if (kind === 'moved') {
    const from = p.fromLocationId ? names.place?.(p.fromLocationId) : undefined;
    const to = p.toLocationId ? names.place?.(p.toLocationId) : undefined;
    if (from || to)
      parts.push([from && `from ${from}`, to && `to ${to}`].filter(Boolean).join(' '));
    if (p.rehoused) parts.push('into a new enclosure');
  }
  if (p.from && p.to) parts.push(`${STATUS_LABEL[p.from]} → ${STATUS_LABEL[p.to]}`);
  if (p.text) parts.push(p.text);
  if (p.note) parts.push(`note: ${p.note}`);
  return parts.filter(Boolean).join(' · ');
}
