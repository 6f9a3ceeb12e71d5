// The invented demo collection (demo scenario): people, room layout, ~43 animals and about
// 60 days of history, arranged so that "today" shows every rule of the round engine.
import { randomUUID } from 'node:crypto';
import { eq, inArray } from 'drizzle-orm';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import type { AnimalGroup, Caution, LifeStage, Sex } from '#shared/domain/animal-facts';
import { breedingFacts, breedingModeOf, type BreedingRecordKind } from '#shared/domain/breeding';
import type { EventKind } from '#shared/domain/event-kinds';
import { generateLabelCodes } from '#shared/domain/label-codes';
import { addDays, localDateOf, startOfLocalDate, type LocalDate } from '#shared/domain/local-dates';
import { hydrationEvery } from '#shared/domain/rounds/enclosure-care';
import { DEFAULT_RULES, feedingInterval, postMoltHoldDays } from '#shared/domain/rounds/rules';
import { insertCollection } from '../access/collections';
import { DEMO_ACCOUNTS, DEMO_COLLECTION, DEMO_PASSWORD } from '../access/demo-people';
import { newInviteToken } from '../access/invite-token';
import { hashPassword } from '../access/passwords';
import { animals, eggSacs } from '../db/schema/animals';
import { climateReadings, roomTargets } from '../db/schema/climate';
import { collections, invites, locations, memberships } from '../db/schema/collections';
import { users } from '../db/schema/users';
import { refoldStates } from '../features/events/projection';
import { recordEvents } from '../features/events/record-events';
import { seedColonies } from './colonies';
import { seedSales } from './sales';
import { DEMO_CLUTCH, seedSalesStock } from './sales-stock';

export { DEMO_PASSWORD };

/** Small seeded generator (mulberry32) so the demo is the same on every machine. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

interface DemoAnimal {
  name: string;
  scientificName: string;
  commonName?: string;
  group: AnimalGroup;
  lifeStage: LifeStage;
  sex: Sex;
  sizeMm: number;
  place: [rack: string, shelf: string, position: string];
  cautions?: Caution[];
  hasWaterDish?: boolean;
  /** Slings from one egg sac share a clutch name. */
  clutch?: string;
  /** What happened recently, driving today's round (see the scenario's "states"). */
  story?:
    | 'two_refusals'
    | 'premolt'
    | 'molted_5_days'
    | 'sac_3_weeks'
    | 'paired_10_days'
    | 'prey_left_yesterday'
    | 'missed'
    | 'guarding_sac'
    | 'brood_on_back'
    | 'egg_case'
    | 'clutch_potted';
  /** Days since the animal came to the collection, where the seed must not draw it at random. */
  acquiredDaysAgo?: number;
  /** Its own spot-clean interval (R21); 0: never on the round. */
  spotCleanEveryDays?: number;
  /** Days since its last spot-clean (R21); 1 unless a story needs one due. */
  spotCleanedDaysAgo?: number;
  /** Inside of its enclosure in mm (length, width, and height for a tall one): R22. */
  enclosure?: [length: number, width: number, height?: number];
}

/**
 * The demo's breeding records (sac, egg case, brood), as days before today. Their facts go on
 * each female's history from the record's own dates, as the breeding page writes them.
 */
const BREEDING: Partial<
  Record<
    NonNullable<DemoAnimal['story']>,
    {
      kind: BreedingRecordKind;
      laid: number;
      pulled?: number;
      eggs?: number;
      young?: number;
      /** The clutch name its young share, where they are already in the collection. */
      clutch?: string;
      note: string;
    }
  >
> = {
  sac_3_weeks: {
    kind: 'egg_sac',
    laid: -21,
    pulled: -20,
    eggs: 140,
    note: 'Pulled for incubation.',
  },
  guarding_sac: { kind: 'egg_sac', laid: -4, note: 'Sac laid in the hide; she is guarding it.' },
  brood_on_back: {
    kind: 'brood',
    laid: -5,
    young: 23,
    note: 'Scorplings white and riding on her back.',
  },
  egg_case: { kind: 'egg_case', laid: -10, note: 'Ootheca on the lid mesh.' },
  // The sac the demo's 24 Hapalopus formosus slings came from (trays C1 and C2).
  clutch_potted: {
    kind: 'egg_sac',
    laid: -150,
    pulled: -149,
    eggs: 61,
    young: 24,
    clutch: 'H. formosus sac 1',
    note: 'Pulled for incubation; 24 slings potted up into trays C1 and C2.',
  },
};

/**
 * The mother of the sling clutch, from the demo's own pairing. She comes last in the roster, and
 * her code and arrival date are not drawn from the shared generator, so every other animal's
 * code and history stay as they were before she was added.
 */
const MOTHER: DemoAnimal = {
  name: 'Marigold',
  scientificName: 'Hapalopus formosus',
  commonName: 'Colombian pumpkin patch',
  group: 'tarantula',
  lifeStage: 'adult',
  sex: 'female',
  sizeMm: 75,
  place: ['A', '2', '4'],
  cautions: ['urticating_hairs'],
  hasWaterDish: true,
  story: 'clutch_potted',
  acquiredDaysAgo: 400,
};

const ADULTS: DemoAnimal[] = [
  {
    name: 'Juniper',
    scientificName: 'Tliltocatl albopilosus',
    commonName: 'Curly hair tarantula',
    group: 'tarantula',
    lifeStage: 'adult',
    sex: 'female',
    sizeMm: 130,
    place: ['A', '1', '1'],
    cautions: ['urticating_hairs'],
    hasWaterDish: true,
    story: 'sac_3_weeks',
  },
  {
    name: 'Pepper',
    scientificName: 'Grammostola pulchra',
    commonName: 'Brazilian black',
    group: 'tarantula',
    lifeStage: 'adult',
    sex: 'female',
    sizeMm: 150,
    place: ['A', '1', '2'],
    cautions: ['urticating_hairs'],
    hasWaterDish: true,
    story: 'guarding_sac',
  },
  {
    name: 'Dusty',
    scientificName: 'Aphonopelma chalcodes',
    commonName: 'Desert blonde',
    group: 'tarantula',
    lifeStage: 'adult',
    sex: 'female',
    sizeMm: 125,
    place: ['A', '1', '3'],
    cautions: ['urticating_hairs'],
    hasWaterDish: true,
    story: 'missed',
  },
  {
    name: 'Bramble',
    scientificName: 'Acanthoscurria geniculata',
    commonName: 'Whitebanded tarantula',
    group: 'tarantula',
    lifeStage: 'adult',
    sex: 'female',
    sizeMm: 170,
    place: ['A', '1', '4'],
    cautions: ['urticating_hairs', 'fast_defensive'],
    hasWaterDish: true,
    story: 'two_refusals',
  },
  {
    name: 'Indigo',
    scientificName: 'Monocentropus balfouri',
    commonName: 'Socotra Island blue baboon',
    group: 'tarantula',
    lifeStage: 'adult',
    sex: 'female',
    sizeMm: 120,
    place: ['A', '2', '1'],
    cautions: ['potent_venom', 'fast_defensive'],
    hasWaterDish: true,
    story: 'paired_10_days',
  },
  {
    name: 'Blue Jay',
    scientificName: 'Monocentropus balfouri',
    commonName: 'Socotra Island blue baboon',
    group: 'tarantula',
    lifeStage: 'adult',
    sex: 'mature_male',
    sizeMm: 110,
    place: ['A', '2', '2'],
    cautions: ['potent_venom', 'fast_defensive'],
    hasWaterDish: true,
  },
  {
    name: 'Ember',
    scientificName: 'Omothymus schioedtei',
    commonName: 'Malaysian earth tiger',
    group: 'tarantula',
    lifeStage: 'adult',
    sex: 'female',
    sizeMm: 180,
    place: ['A', '2', '3'],
    cautions: ['potent_venom', 'fast_defensive', 'escape_risk'],
    hasWaterDish: true,
    story: 'missed',
  },
  {
    name: 'Rattler',
    scientificName: 'Scolopendra heros',
    commonName: 'Giant desert centipede',
    group: 'centipede',
    lifeStage: 'adult',
    sex: 'unknown',
    sizeMm: 160,
    place: ['A', '3', '1'],
    cautions: ['potent_venom', 'fast_defensive', 'escape_risk'],
    hasWaterDish: true,
  },
  {
    name: 'Pinch',
    scientificName: 'Heterometrus spinifer',
    commonName: 'Giant forest scorpion',
    group: 'scorpion',
    lifeStage: 'adult',
    sex: 'female',
    sizeMm: 110,
    place: ['A', '3', '2'],
    cautions: ['sting'],
    hasWaterDish: true,
    story: 'brood_on_back',
  },
  {
    name: 'Mantra',
    scientificName: 'Hierodula membranacea',
    commonName: 'Giant Asian mantis',
    group: 'mantis',
    lifeStage: 'adult',
    sex: 'female',
    sizeMm: 90,
    place: ['A', '3', '3'],
    story: 'egg_case',
  },
];

const JUVENILES: DemoAnimal[] = [
  {
    name: 'Verdi',
    scientificName: 'Caribena versicolor',
    commonName: 'Martinique pinktoe',
    group: 'tarantula',
    lifeStage: 'juvenile',
    sex: 'unknown',
    sizeMm: 75,
    place: ['B', '1', '1'],
    // An arboreal pinktoe in a tall enclosure: 3 × 75 mm is 225 mm of height (R22).
    enclosure: [200, 200, 300],
    cautions: ['fast_defensive'],
    hasWaterDish: true,
    story: 'premolt',
  },
  {
    name: 'Goliath Jr',
    scientificName: 'Theraphosa stirmi',
    commonName: 'Burgundy goliath birdeater',
    group: 'tarantula',
    lifeStage: 'subadult',
    sex: 'female',
    sizeMm: 140,
    place: ['B', '1', '2'],
    // Outgrown at its molt 5 days ago (2 × 140 mm > 250 mm): rehoused after the hold (R22).
    enclosure: [400, 250],
    cautions: ['urticating_hairs'],
    hasWaterDish: true,
    story: 'molted_5_days',
  },
  {
    name: 'Rusty',
    scientificName: 'Harpactira pulchripes',
    commonName: 'Golden blue-leg baboon',
    group: 'tarantula',
    lifeStage: 'juvenile',
    sex: 'unknown',
    sizeMm: 50,
    place: ['B', '1', '3'],
    // Last spot-cleaned 15 days ago: due again after 14 (R21).
    spotCleanedDaysAgo: 15,
    enclosure: [200, 150],
    cautions: ['potent_venom', 'fast_defensive'],
  },
  {
    name: 'Tiger',
    scientificName: 'Davus pentaloris',
    commonName: 'Guatemalan tiger rump',
    group: 'tarantula',
    lifeStage: 'juvenile',
    sex: 'unknown',
    sizeMm: 40,
    place: ['B', '2', '1'],
    cautions: ['urticating_hairs', 'fast_defensive'],
    story: 'missed',
  },
  {
    name: 'Ruby',
    scientificName: 'Tliltocatl vagans',
    commonName: 'Mexican red rump',
    group: 'tarantula',
    lifeStage: 'subadult',
    sex: 'female',
    sizeMm: 95,
    place: ['B', '2', '2'],
    enclosure: [300, 200],
    cautions: ['urticating_hairs'],
    hasWaterDish: true,
  },
  {
    name: 'Stripes',
    scientificName: 'Nhandu chromatus',
    commonName: 'Brazilian red and white',
    group: 'tarantula',
    lifeStage: 'juvenile',
    sex: 'unknown',
    sizeMm: 60,
    place: ['B', '2', '3'],
    // Molted and outgrew its 110 × 100 mm tub: 2 × 60 mm is 120 mm (R22), so a rehouse is due.
    enclosure: [110, 100],
    cautions: ['urticating_hairs', 'fast_defensive'],
  },
  {
    name: 'Pebble',
    scientificName: 'Cyriocosmus elegans',
    commonName: 'Trinidad dwarf tiger',
    group: 'tarantula',
    lifeStage: 'sling',
    sex: 'unknown',
    sizeMm: 12,
    place: ['B', '3', '4'],
    enclosure: [60, 60],
  },
  {
    name: 'Flicker',
    scientificName: 'Kochiana brunnipes',
    commonName: 'Brazilian dwarf beauty',
    group: 'tarantula',
    lifeStage: 'sling',
    sex: 'unknown',
    sizeMm: 15,
    place: ['B', '3', '5'],
  },
];

function clutch(): DemoAnimal[] {
  return Array.from({ length: 24 }, (_, i) => {
    const tray = i < 12 ? '1' : '2';
    const pot = String((i % 12) + 1).padStart(2, '0');
    return {
      name: `Formosus ${String(i + 1).padStart(2, '0')}`,
      scientificName: 'Hapalopus formosus',
      commonName: 'Colombian pumpkin patch',
      group: 'tarantula',
      lifeStage: 'sling',
      sex: 'unknown',
      sizeMm: 10 + (i % 5),
      place: ['C', tray, pot],
      cautions: ['urticating_hairs'],
      clutch: 'H. formosus sac 1',
      // Pots of one clutch are cleaned when potted up, not on the round (the animal's own 0).
      spotCleanEveryDays: 0,
      story: i === 3 ? 'prey_left_yesterday' : i === 7 || i === 15 ? 'missed' : undefined,
    } satisfies DemoAnimal;
  });
}

// Demo history follows the round engine's own defaults (docs/care-rules.md): its intervals (R1)
// and post-molt holds (R5), so the history obeys the rules it demonstrates.
const OFFER: Partial<Record<LifeStage, { preyType: string; preySize: string; count: number }>> = {
  sling: { preyType: 'fruit-fly larvae', preySize: 'tiny', count: 1 },
  juvenile: { preyType: 'cricket', preySize: 'small', count: 1 },
  subadult: { preyType: 'roach nymph', preySize: 'medium', count: 2 },
  adult: { preyType: 'cricket', preySize: 'large', count: 2 },
};

interface SeedEvent {
  kind: EventKind;
  day: LocalDate;
  minute: number;
  payload?: Record<string, unknown>;
  by: 'owner' | 'partner';
}

/** The history of one animal over the last `days` days, ending yesterday or today. */
export function historyFor(
  animal: DemoAnimal,
  today: LocalDate,
  random: () => number,
): SeedEvent[] {
  const interval = feedingInterval(DEFAULT_RULES, { ...animal, intervalDays: null });
  const hold = postMoltHoldDays(DEFAULT_RULES, animal);
  const offer = OFFER[animal.lifeStage] ?? OFFER.adult!;
  const out: SeedEvent[] = [];
  const at = (offset: number): LocalDate => addDays(today, offset);
  const by = (): 'owner' | 'partner' => (random() < 0.75 ? 'owner' : 'partner');
  const minute = () => 18 * 60 + Math.floor(random() * 150); // evening rounds, 18:00–20:30

  // Routine feeding from 60 days ago until the story takes over.
  // Routine history stops before the first event of the animal's story.
  const storyStart: Record<NonNullable<DemoAnimal['story']> | 'none', number> = {
    none: 0,
    two_refusals: -26,
    premolt: -13,
    molted_5_days: -16,
    sac_3_weeks: -21,
    paired_10_days: -12,
    prey_left_yesterday: -4,
    missed: -1,
    guarding_sac: -4,
    brood_on_back: -5,
    egg_case: -10,
    clutch_potted: 0,
  };
  const stopAt = storyStart[animal.story ?? 'none'];
  let offset = -60 + Math.floor(random() * interval);
  const lastRoutine = animal.story === 'missed' ? -interval - 1 : stopAt - 1;
  // A molt somewhere in the middle of the history for growing animals, to fill the charts; no
  // meal is offered from a week before it (premolt) until its hold ends (R4, R5).
  const grows =
    animal.lifeStage !== 'adult' && animal.story !== 'molted_5_days' && animal.story !== 'premolt';
  const moltAt = grows ? -35 - Math.floor(random() * 10) : null;
  while (offset <= lastRoutine && offset < 0) {
    if (moltAt !== null && offset > moltAt - 7 && offset < moltAt + hold) {
      offset = moltAt + hold;
      continue;
    }
    // Never two refusals in a row here: that flags a possible premolt (R3), and no meal follows.
    const roll = random() < 0.08;
    const refused = roll && out.at(-1)?.kind !== 'refused';
    out.push({
      kind: refused ? 'refused' : 'ate',
      day: at(offset),
      minute: minute(),
      by: by(),
      payload: refused ? {} : { ...offer },
    });
    offset += refused ? Math.max(2, Math.round(interval / 2)) : interval;
  }
  // Dishes topped up every 3 days (R7); dish-less slings' substrate moistened every 4 days and
  // the mantis misted every 2 (§ Enclosure care). Animals whose story must show on today's
  // round were last watered three days ago; Pebble and Flicker are due a moistening today.
  const moisten = hydrationEvery('moisten', { ...animal, hasWaterDish: false }, DEFAULT_RULES);
  const mist = hydrationEvery('mist', { ...animal, hasWaterDish: false }, DEFAULT_RULES);
  if (animal.hasWaterDish || animal.lifeStage === 'sling' || animal.group === 'mantis') {
    const last =
      animal.story === 'premolt' || animal.story === 'molted_5_days'
        ? -3
        : -1 - Math.floor(random() * 3);
    for (let d = last; d >= -60; d -= 3) {
      // Drawn for every animal of this branch alike, so the rest of the demo's history (drawn
      // from the same sequence) stays as it was before enclosure care.
      const when = minute();
      const who = by();
      if (animal.hasWaterDish) out.push({ kind: 'watered', day: at(d), minute: when, by: who });
    }
    if (!animal.hasWaterDish && moisten) {
      const from = animal.name === 'Pebble' || animal.name === 'Flicker' ? -4 : last;
      for (let d = from; d >= -60; d -= moisten.every)
        out.push({ kind: 'substrate_moistened', day: at(d), minute: 18 * 60, by: 'owner' });
    } else if (!animal.hasWaterDish && mist)
      for (let d = -mist.every; d >= -60; d -= mist.every)
        out.push({ kind: 'misted', day: at(d), minute: 18 * 60, by: 'owner' });
  }
  // Small dish-less juveniles (Rusty, Tiger, Stripes) have no moistening recorded: due today.
  // Spot-cleaned yesterday (R21): only a meal from yesterday leaves a bolus for today.
  if (animal.story !== 'guarding_sac' && animal.story !== 'brood_on_back')
    out.push({
      kind: 'spot_cleaned',
      day: at(-(animal.spotCleanedDaysAgo ?? 1)),
      minute: 17 * 60,
      by: 'owner',
    });
  if (moltAt !== null)
    out.push({
      kind: 'molted',
      day: at(moltAt),
      minute: minute(),
      by: by(),
      payload: { sizeMm: animal.sizeMm },
    });

  switch (animal.story) {
    case 'two_refusals':
      out.push({ kind: 'ate', day: at(-26), minute: minute(), by: 'owner', payload: { ...offer } });
      out.push({ kind: 'refused', day: at(-14), minute: minute(), by: 'owner' });
      out.push({
        kind: 'refused',
        day: at(-7),
        minute: minute(),
        by: 'partner',
        payload: { note: 'Turned away from the tongs again.' },
      });
      break;
    case 'premolt':
      out.push({ kind: 'ate', day: at(-13), minute: minute(), by: 'owner', payload: { ...offer } });
      out.push({
        kind: 'premolt_seen',
        day: at(-2),
        minute: minute(),
        by: 'owner',
        payload: { note: 'Abdomen dark and shiny, molt mat started.' },
      });
      break;
    case 'molted_5_days':
      out.push({ kind: 'ate', day: at(-16), minute: minute(), by: 'owner', payload: { ...offer } });
      out.push({
        kind: 'molted',
        day: at(-5),
        minute: 7 * 60 + 40,
        by: 'owner',
        payload: { sizeMm: animal.sizeMm, exuviaeKept: true },
      });
      break;
    case 'sac_3_weeks':
      // The sac itself is a breeding record (BREEDING): laid 21 days ago, pulled the next day.
      out.push({ kind: 'ate', day: at(-6), minute: minute(), by: 'owner', payload: { ...offer } });
      break;
    case 'egg_case':
      // A mantis feeds on through her egg case: a meal two days ago, so she is not due today.
      out.push({ kind: 'ate', day: at(-2), minute: minute(), by: 'owner', payload: { ...offer } });
      break;
    case 'paired_10_days':
      out.push({ kind: 'ate', day: at(-12), minute: minute(), by: 'owner', payload: { ...offer } });
      out.push({
        kind: 'paired',
        day: at(-10),
        minute: 20 * 60,
        by: 'owner',
        payload: {
          outcome: 'accepted',
          note: 'Male tapped, she accepted; separated after insertion.',
        },
      });
      out.push({ kind: 'ate', day: at(-6), minute: minute(), by: 'owner', payload: { ...offer } });
      break;
    case 'prey_left_yesterday':
      out.push({ kind: 'ate', day: at(-4), minute: minute(), by: 'owner', payload: { ...offer } });
      out.push({
        kind: 'prey_left_in',
        day: at(-1),
        minute: minute(),
        by: 'partner',
        payload: { ...offer },
      });
      break;
    default:
      break;
  }
  return out;
}

export interface SeedOptions {
  reset?: boolean;
  ifEmpty?: boolean;
  bcryptCost?: number;
  now?: Date;
}

export async function seedDemo(db: NodePgDatabase, options: SeedOptions = {}) {
  const emails = DEMO_ACCOUNTS.map((a) => a.email);
  const existing = await db
    .select({ id: users.id })
    .from(users)
    .where(inArray(users.email, emails));
  if (existing.length && !options.reset) return { created: false, animals: 0, events: 0 };
  if (existing.length) {
    const owned = await db
      .select({ collectionId: memberships.collectionId })
      .from(memberships)
      .where(
        inArray(
          memberships.userId,
          existing.map((u) => u.id),
        ),
      );
    const ids = [...new Set(owned.map((o) => o.collectionId))];
    if (ids.length) await db.delete(collections).where(inArray(collections.id, ids));
    await db.delete(users).where(inArray(users.email, emails));
  }

  const zone = DEMO_COLLECTION.timeZone;
  const now = options.now ?? new Date();
  const today = localDateOf(now, zone);
  const random = seededRandom(20261201);
  const passwordHash = await hashPassword(DEMO_PASSWORD, options.bcryptCost ?? 11);

  return db.transaction(async (tx) => {
    const people = await tx
      .insert(users)
      .values(
        DEMO_ACCOUNTS.map((a) => ({ email: a.email, displayName: a.displayName, passwordHash })),
      )
      .returning({ id: users.id, email: users.email });
    const idOf = (email: string) => people.find((p) => p.email === email)!.id;
    const ownerId = idOf(DEMO_ACCOUNTS[0].email);
    const partnerId = idOf(DEMO_ACCOUNTS[1].email);

    // The demo flags adults after two refusals (the default is three): a collection's own rule.
    const collectionId = await insertCollection(tx, {
      ...DEMO_COLLECTION,
      rules: { profiles: { tarantula: { stages: { adult: { refusalStreak: 2 } } } } },
    });

    // The helper covers 7 days from the Friday after today.
    const weekday = new Date(`${today}T12:00:00Z`).getUTCDay();
    const firstDay = addDays(today, (5 - weekday + 7) % 7 || 7);
    const helperId = idOf(DEMO_ACCOUNTS[2].email);
    const cover = {
      startsAt: startOfLocalDate(firstDay, zone),
      endsAt: startOfLocalDate(addDays(firstDay, 7), zone),
    };
    await tx.insert(memberships).values([
      { collectionId, userId: ownerId, role: 'owner' },
      { collectionId, userId: partnerId, role: 'keeper' },
      { collectionId, userId: helperId, role: 'helper', ...cover },
    ]);
    // The invite the helper accepted a day ago: the owner's cover page lists the cover from it
    // (its days, the helper, and the buttons to change or end it). Its link is spent.
    await tx.insert(invites).values({
      collectionId,
      email: DEMO_ACCOUNTS[2].email,
      role: 'helper',
      tokenHash: newInviteToken().tokenHash,
      message: 'Feeders are in the blue tub under rack A. Call me if anything looks wrong.',
      ...cover,
      createdAt: new Date(now.getTime() - 2 * 86_400_000),
      expiresAt: new Date(now.getTime() - 86_400_000),
      acceptedAt: new Date(now.getTime() - 86_400_000),
      acceptedBy: helperId,
      invitedBy: ownerId,
    });

    const roster = [...ADULTS, ...JUVENILES, ...clutch(), MOTHER];
    const places = new Map<string, string>();
    const placeRows = roster.map((a) => ({
      collectionId,
      room: 'Spare room',
      rack: a.place[0],
      shelf: a.place[1],
      position: a.place[2],
    }));
    // Empty spots exist too: the room has more positions than animals.
    for (const [rack, shelves, positions] of [
      ['A', 3, 4],
      ['B', 3, 5],
    ] as const) {
      for (let s = 1; s <= shelves; s++) {
        for (let p = 1; p <= positions; p++) {
          if (
            !placeRows.some(
              (r) => r.rack === rack && r.shelf === String(s) && r.position === String(p),
            )
          ) {
            placeRows.push({
              collectionId,
              room: 'Spare room',
              rack,
              shelf: String(s),
              position: String(p),
            });
          }
        }
      }
    }
    const insertedPlaces = await tx.insert(locations).values(placeRows).returning();
    await seedRoomClimate(tx, { collectionId, zone, today, recordedBy: partnerId });
    for (const l of insertedPlaces) places.set(`${l.rack}|${l.shelf}|${l.position}`, l.id);

    const drawn = roster.filter((a) => a !== MOTHER);
    const codes = generateLabelCodes('NL', drawn.length, random);
    codes.push(...generateLabelCodes('NL', 1, seededRandom(20260702), new Set(codes)));
    const insertedAnimals = await tx
      .insert(animals)
      .values(
        roster.map((a, i) => ({
          collectionId,
          labelCode: codes[i]!,
          name: a.name,
          scientificName: a.scientificName,
          commonName: a.commonName ?? null,
          group: a.group,
          lifeStage: a.lifeStage,
          sex: a.sex,
          sizeMm: a.sizeMm,
          locationId: places.get(a.place.join('|'))!,
          hasWaterDish: a.hasWaterDish ?? false,
          spotCleanEveryDays: a.spotCleanEveryDays ?? null,
          enclosureLengthMm: a.enclosure?.[0] ?? null,
          enclosureWidthMm: a.enclosure?.[1] ?? null,
          enclosureHeightMm: a.enclosure?.[2] ?? null,
          cautions: a.cautions ?? [],
          clutch: a.clutch ?? null,
          acquiredOn: addDays(
            today,
            a.acquiredDaysAgo !== undefined
              ? -a.acquiredDaysAgo
              : -200 - Math.floor(random() * 300),
          ),
          // In Rackside since before the history begins, and settled in (R16) by then.
          createdAt: startOfLocalDate(addDays(today, -65), zone),
        })),
      )
      .returning({ id: animals.id });

    const rows = roster.flatMap((a, i) =>
      historyFor(a, today, random).map((e) => {
        const at = new Date(startOfLocalDate(e.day, zone).getTime() + e.minute * 60_000);
        return {
          id: randomUUID(),
          collectionId,
          animalId: insertedAnimals[i]!.id,
          kind: e.kind,
          payload: e.payload ?? {},
          recordedBy: e.by === 'owner' ? ownerId : partnerId,
          deviceId: 'demo-seed',
          clientRecordedAt: at,
          clientSentAt: at,
          serverReceivedAt: at,
          effectiveAt: at,
        };
      }),
    );
    // Breeding records, with their facts dated as the keeper gave them (noon that day).
    const ownerOf = { recordedBy: ownerId, deviceId: 'demo-seed' };
    for (const [i, a] of roster.entries()) {
      const plan = a.story ? BREEDING[a.story] : undefined;
      if (!plan) continue;
      const femaleId = insertedAnimals[i]!.id;
      const window = breedingModeOf(a.group).window ?? { minDays: 42, maxDays: 56 };
      const [record] = await tx
        .insert(eggSacs)
        .values({
          collectionId,
          femaleId,
          kind: plan.kind,
          clutch:
            plan.clutch ??
            `${a.name} ${plan.kind === 'egg_sac' ? 'sac' : plan.kind === 'brood' ? 'brood' : 'case'} ${addDays(today, plan.laid)}`,
          laidOn: addDays(today, plan.laid),
          pulledOn: plan.pulled !== undefined ? addDays(today, plan.pulled) : null,
          eggCount: plan.eggs ?? null,
          slingCount: plan.young ?? null,
          incubationMinDays: window.minDays,
          incubationMaxDays: window.maxDays,
          notes: plan.note,
        })
        .returning();
      for (const fact of breedingFacts(record!)) {
        const at = new Date(startOfLocalDate(fact.date, zone).getTime() + 12 * 3_600_000);
        rows.push({
          id: randomUUID(),
          collectionId,
          animalId: femaleId,
          kind: fact.kind,
          payload: { sacId: record!.id },
          ...ownerOf,
          clientRecordedAt: at,
          clientSentAt: at,
          serverReceivedAt: at,
          effectiveAt: at,
        });
      }
    }
    await recordEvents(tx, { collectionId }, rows, { from: 'history' });
    await refoldStates(tx, collectionId, zone);
    await seedColonies(tx, collectionId, ownerId, today, zone);
    // Sales — L: 12 of the clutch's slings offered for sale.
    await seedSalesStock(
      tx,
      collectionId,
      ownerId,
      roster.flatMap((a, i) => (a.clutch === DEMO_CLUTCH ? [insertedAnimals[i]!.id] : [])),
    );
    await seedSales(tx, collectionId);
    return { created: true, animals: roster.length, events: rows.length, collectionId, today };
  });
}

/**
 * The spare room's range (a warm, fairly humid room for the tarantulas: common practice, no
 * published source) and a week of the partner's morning readings, one above the range three
 * days ago: the chart and the animals' timelines show it; Today (last day only) does not, so
 * the day's reading is due.
 */
async function seedRoomClimate(
  tx: Parameters<Parameters<NodePgDatabase['transaction']>[0]>[0],
  c: { collectionId: string; zone: string; today: LocalDate; recordedBy: string },
) {
  await tx.insert(roomTargets).values({
    collectionId: c.collectionId,
    room: 'Spare room',
    minCelsius: 22,
    maxCelsius: 27,
    minHumidity: 60,
    maxHumidity: 75,
  });
  const week: [number, number, number][] = [
    [22.5, 25.5, 68],
    [23, 26, 66],
    [22.8, 25.8, 70],
    [23.4, 29.5, 64], // three days ago: the heater's thermostat stuck on
    [23.1, 26.2, 67],
    [22.6, 25.9, 69],
  ];
  await tx.insert(climateReadings).values(
    week.map(([min, max, humidity], i) => ({
      id: randomUUID(),
      collectionId: c.collectionId,
      room: 'Spare room',
      // 08:00 local on each of the six days before today.
      takenAt: new Date(
        startOfLocalDate(addDays(c.today, i - week.length), c.zone).getTime() + 8 * 3_600_000,
      ),
      minCelsius: min,
      maxCelsius: max,
      humidity,
      source: 'typed' as const,
      recordedBy: c.recordedBy,
    })),
  );
}

export async function demoCollectionId(db: NodePgDatabase): Promise<string | null> {
  const [row] = await db
    .select({ id: collections.id })
    .from(collections)
    .innerJoin(memberships, eq(memberships.collectionId, collections.id))
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(users.email, DEMO_ACCOUNTS[0].email))
    .limit(1);
  return row?.id ?? null;
}
