import { sameType } from '../rounds/feeders';

// Feeder colonies' stock (docs/care-rules.md § Feeder colonies): estimated whole counts per
// catalogue size, the prep list's draw on them, and what a fed animal takes away.

/** A colony as the draw reads it: its prey type and its estimated count per size. */
export interface ColonyStock {
  id: string;
  name: string;
  preyType: string;
  /** Size name (from the feeder catalogue) → estimated count. */
  stock: Readonly<Record<string, number>>;
}

/** An estimate as stored: a whole number, never below zero (a keeper's "about 40"). */
export function wholeEstimate(n: number): number {
  if (!Number.isFinite(n)) return 0;
  return Math.max(0, Math.round(n));
}

/**
 * A change to one size's count. The count never goes below zero, so `applied` is what really
 * changed: taking 10 from 6 applies −6, and giving those back later puts back exactly 6.
 */
export function applyDelta(count: number, delta: number): { count: number; applied: number } {
  const before = wholeEstimate(count);
  const after = wholeEstimate(before + Math.round(delta));
  return { count: after, applied: after - before };
}

/** The changes a count update makes: per size, from the stock held to the counts seen. */
export function countUpdateDeltas(
  held: Readonly<Record<string, number>>,
  seen: readonly { preySize: string; count: number }[],
): { preySize: string; delta: number }[] {
  const out: { preySize: string; delta: number }[] = [];
  for (const s of seen) {
    const key = sizeKeyOf(held, s.preySize) ?? s.preySize;
    const delta = wholeEstimate(s.count) - wholeEstimate(held[key] ?? 0);
    if (delta !== 0) out.push({ preySize: key, delta });
  }
  return out;
}

/** The colony's own spelling of a size, matched loosely ("Small nymph" = "small nymph"). */
export function sizeKeyOf(stock: Readonly<Record<string, number>>, size: string): string | null {
  return Object.keys(stock).find((k) => sameType(k, size)) ?? null;
}

export const stockOf = (colony: ColonyStock, size: string): number => {
  const key = sizeKeyOf(colony.stock, size);
  return key === null ? 0 : wholeEstimate(colony.stock[key] ?? 0);
};

export interface Draw {
  colonyId: string;
  colonyName: string;
  /** The colony's own spelling of the size, so the change lands on its row. */
  preySize: string;
  count: number;
}

export interface LineDraw {
  /** How many the line needs (the prep list's upper count: plan for the most). */
  need: number;
  draws: Draw[];
  /** What the colonies of that prey type cannot supply; 0 when they hold enough. */
  short: number;
  /** Whether any colony keeps this prey type at all (no colony: the line reads as before). */
  kept: boolean;
}

/**
 * The draw rule: a line of `need` prey of a type and size is pulled from the colony of that
 * type holding the most of that size (ties by name, then id, so the answer never wobbles);
 * when it holds fewer than needed, all of it is taken and the rest comes from the next
 * fullest, and so on. Whatever all of them together cannot supply is `short`.
 */
export function drawLine(
  preyType: string,
  preySize: string,
  need: number,
  colonies: readonly ColonyStock[],
): LineDraw {
  const ofType = colonies.filter((c) => sameType(c.preyType, preyType));
  const holding = ofType
    .map((c) => ({ c, held: stockOf(c, preySize), key: sizeKeyOf(c.stock, preySize) ?? preySize }))
    .filter((h) => h.held > 0)
    .sort(
      (a, b) => b.held - a.held || a.c.name.localeCompare(b.c.name) || a.c.id.localeCompare(b.c.id),
    );
  let left = wholeEstimate(need);
  const draws: Draw[] = [];
  for (const h of holding) {
    if (left === 0) break;
    const count = Math.min(left, h.held);
    draws.push({ colonyId: h.c.id, colonyName: h.c.name, preySize: h.key, count });
    left -= count;
  }
  return { need: wholeEstimate(need), draws, short: left, kept: ofType.length > 0 };
}

export interface PrepLineLike {
  preyType: string;
  preySize: string;
  countMin: number;
  countMax: number;
}

/** Every prep line with its draw. Lines never compete: each is one type and size. */
export function drawPrepList<L extends PrepLineLike>(
  lines: readonly L[],
  colonies: readonly ColonyStock[],
): (L & { draw: LineDraw })[] {
  return lines.map((l) => ({
    ...l,
    draw: drawLine(l.preyType, l.preySize, l.countMax, colonies),
  }));
}

/** The warning for a short line, in words; null when the colonies hold enough (or none keep it). */
export function shortWarning(line: PrepLineLike & { draw: LineDraw }): string | null {
  const { draw } = line;
  if (!draw.kept || draw.short === 0) return null;
  const held = draw.need - draw.short;
  const what = `${line.preySize} ${line.preyType}`;
  if (held === 0) return `Needs ${draw.need} ${what}; no colony holds any.`;
  const from = draw.draws.map((d) => `${d.colonyName} ${d.count}`).join(', ');
  return `Needs ${draw.need} ${what}; the colonies hold ${held} (${from}): ${draw.short} short.`;
}

/** The round's outcomes that put prey in an enclosure: these come off a colony. */
export const PREY_USING_KINDS = ['ate', 'prey_left_in'] as const;

/**
 * What one outcome took from the colonies: the prey the tap names, else the feed task's offer
 * that day. The count is the tap's own, else the offer's lower count — what was surely put in
 * (an offer of 2–3 is at least 2); a keeper corrects the rest with a count update.
 * Null for other outcomes, or when neither names a prey type and size.
 */
export function preyUsed(
  kind: string,
  payload: { preyType?: unknown; preySize?: unknown; count?: unknown },
  offer: PrepLineLike | null,
): { preyType: string; preySize: string; count: number } | null {
  if (!(PREY_USING_KINDS as readonly string[]).includes(kind)) return null;
  const str = (v: unknown) => (typeof v === 'string' && v.trim() ? v.trim() : null);
  const preyType = str(payload.preyType) ?? offer?.preyType ?? null;
  const preySize = str(payload.preySize) ?? offer?.preySize ?? null;
  if (!preyType || !preySize) return null;
  const given = typeof payload.count === 'number' ? payload.count : null;
  const count = wholeEstimate(given ?? offer?.countMin ?? 1);
  return count > 0 ? { preyType, preySize, count } : null;
}
