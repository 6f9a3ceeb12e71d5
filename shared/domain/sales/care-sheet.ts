import {
  SEX_LABEL,
  stageLabel,
  type AnimalGroup,
  type Caution,
  type Diet,
  type LifeStage,
  type Sex,
} from '../animal-facts';
import { formatLocalDate } from '../date-words';
import type { LocalDate } from '../local-dates';
import { foodOf, GROUP_CARE } from '../rounds/care-profiles';
import { hydrationEvery } from '../rounds/enclosure-care';
import { offerFor } from '../rounds/offer';
import { plural } from '../rounds/reason-words';
import { feedingInterval, stageCare, type RoundRules } from '../rounds/rules';
import { CAUTION_GUIDANCE, GENERAL_SAFETY } from '../safety';
import { sizeWords } from './availability';

/**
 * A care sheet for the buyer of one animal: what it is, how it has been doing, and how to keep
 * it — fed and watered by the same rules the round follows for it today (feedingInterval,
 * offerFor and hydrationEvery of the round engine, with the collection's own rules), so the
 * sheet never tells a buyer something the keeper's own round does not do.
 */
export interface CareSheetAnimal {
  name: string;
  scientificName: string;
  commonName: string | null;
  group: AnimalGroup;
  lifeStage: LifeStage;
  sex: Sex;
  sizeMm: number | null;
  instar: number | null;
  cautions: readonly Caution[];
  cautionNote: string | null;
  hasWaterDish: boolean;
  intervalDays: number | null;
  preyType: string | null;
  preySize: string | null;
  preyCount: number | null;
  diet: Diet | null;
  mistEveryDays: number | null;
  moistenEveryDays: number | null;
}

export interface CareSheetInput {
  collectionName: string;
  animal: CareSheetAnimal;
  rules: RoundRules;
  lastMolt: LocalDate | null;
  /** Meals, any order; the newest five are shown. `what` is already in words. */
  meals: readonly { date: LocalDate; what: string }[];
  /** The listing's description: what the breeder wrote for the buyer. */
  breederNotes: string;
  issuedOn: LocalDate;
}

export interface CareSheet {
  title: string;
  subtitle: string;
  from: string;
  facts: { label: string; value: string }[];
  meals: { date: string; what: string }[];
  feeding: string[];
  water: string[];
  cautions: { title: string; text: string }[];
  general: string[];
  breederNotes: string | null;
}

// A sheet is read later, elsewhere: always the year, an English date.
const day = (d: LocalDate) => formatLocalDate(d, 'en-GB', { year: 'always', weekday: false });

function feedingLines(a: CareSheetAnimal, rules: RoundRules): string[] {
  const food = foodOf(a);
  const every = feedingInterval(rules, a);
  if (food === 'none') return ['Not fed at this stage: leave it be until its next molt.'];
  if (food === 'substrate')
    return [
      `Eats its substrate: check it every ${plural(every, 'day')} and top it up before it is used up; keep it moist, never wet.`,
    ];
  const offer = offerFor(a, rules);
  const count =
    offer.countMin === offer.countMax ? `${offer.countMin}` : `${offer.countMin}–${offer.countMax}`;
  if (food !== 'prey')
    return [`Fresh ${offer.preyType} every ${plural(every, 'day')}; take out what is left.`];
  const care = stageCare(rules, a);
  const lines = [
    `${count} × ${offer.preyType} (${offer.preySize}) every ${plural(every, 'day')}, offered with long tongs.`,
    'Take out prey it has not eaten by the next day: live prey can injure an animal that is molting.',
    `After a molt, no food for ${plural(care.postMoltHoldDays, 'day')} while the new skin hardens.`,
  ];
  if (care.refusalStreak > 1)
    lines.push(
      `Refusing food ${care.refusalStreak} times in a row usually means a molt is coming: stop offering and keep the water going.`,
    );
  return lines;
}

function waterLines(a: CareSheetAnimal, rules: RoundRules): string[] {
  const lines: string[] = [];
  if (foodOf(a) === 'none' || foodOf(a) === 'substrate') return lines;
  if (a.hasWaterDish)
    lines.push(
      `A shallow water dish, topped up with clean water every ${plural(rules.waterEveryDays, 'day')}.`,
    );
  if (GROUP_CARE[a.group].dampSubstrate) lines.push('Keep part of the substrate damp too.');
  const mist = hydrationEvery('mist', a, rules);
  if (mist)
    lines.push(
      `Mist one wall lightly every ${plural(mist.every, 'day')}: a few droplets to drink, never the animal.`,
    );
  const moisten = hydrationEvery('moisten', a, rules);
  if (moisten)
    lines.push(
      `Moisten one corner of the substrate every ${plural(moisten.every, 'day')}, so part stays damp and part dry. No puddles.`,
    );
  if (!lines.length) lines.push('Offer a shallow water dish once it is large enough to use one.');
  return lines;
}

/** The content of the care sheet, in words, ready to be laid out. Pure. */
export function careSheetContent(input: CareSheetInput): CareSheet {
  const { animal: a, rules } = input;
  const facts = [
    { label: 'Species', value: a.scientificName },
    ...(a.commonName ? [{ label: 'Common name', value: a.commonName }] : []),
    { label: 'Stage', value: stageLabel(a.group, a.lifeStage) },
    { label: 'Sex', value: a.sex === 'unknown' ? 'Not known yet' : SEX_LABEL[a.sex] },
    {
      label: 'Size',
      value: sizeWords({
        sizeMm: a.sizeMm === null ? null : { min: a.sizeMm, max: a.sizeMm },
        instar: a.instar === null ? null : { min: a.instar, max: a.instar },
      }),
    },
    { label: 'Last molt', value: input.lastMolt ? day(input.lastMolt) : 'None recorded' },
  ];
  const meals = [...input.meals]
    .sort((x, y) => (x.date < y.date ? 1 : x.date > y.date ? -1 : 0))
    .slice(0, 5)
    .map((m) => ({ date: day(m.date), what: m.what || 'a meal' }));
  const cautions = a.cautions.map((c) => CAUTION_GUIDANCE[c]);
  if (a.cautionNote?.trim())
    cautions.push({ title: 'From the breeder', text: a.cautionNote.trim() });
  return {
    title: a.commonName ? `${a.scientificName} — ${a.commonName}` : a.scientificName,
    subtitle: `${a.name} · care sheet of ${day(input.issuedOn)}`,
    from: input.collectionName,
    facts,
    meals,
    feeding: feedingLines(a, rules),
    water: waterLines(a, rules),
    cautions,
    // The general cautions, with the law and licence line; the last one (an escape: "call the
    // keeper") is for a helper, so a new keeper gets their own.
    general: [
      ...GENERAL_SAFETY.slice(0, -1),
      'If it escapes: close the room door, keep pets and children out, and search slowly with a catch cup and a card.',
    ],
    breederNotes: input.breederNotes.trim() || null,
  };
}
