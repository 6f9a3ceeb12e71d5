import type { Caution } from './animal-facts';
import type { TaskKind } from './rounds/build-round';

/**
 * What a person covering the feeds must know, in our own words. Sources as in the husbandry
 * rules: Fuchs et al., Toxicon 77:73–77 (2014) on Old World tarantula bites; Blaikie et al.,
 * BMJ 314:1524 (1997) and Carrim et al., Lancet (2010) on urticating hairs and eyes; the rest is
 * common practice among keepers, no published source.
 */
export const CAUTION_GUIDANCE: Record<Caution, { title: string; text: string }> = {
  potent_venom: {
    title: 'Potent venom — never use your hands',
    text: 'A bite can cause severe cramps and pain that may start hours later and last days. Work only with long tongs, keep fingers out of the enclosure, and close the lid before you look away.',
  },
  urticating_hairs: {
    title: 'Irritating hairs — protect your eyes',
    text: 'This animal can flick hairs that itch on skin and can badly injure an eye. Wear glasses or goggles when close, do not lean over the open enclosure, and wash your hands afterwards.',
  },
  fast_defensive: {
    title: 'Fast or defensive — open slowly',
    text: 'It may bolt out or strike at the tongs. Open the lid a little at a time, keep a catch cup ready, and use long tongs.',
  },
  escape_risk: {
    title: 'Escape risk — check the lid',
    text: 'It climbs or squeezes through gaps. Open only as far as you need and check the lid is shut and latched before you move on.',
  },
  sting: {
    title: 'Sting — keep your hands out',
    text: 'It can sting with its tail, and the venom of some species needs medical care. Work only with long tongs, never reach in, and close the lid before you look away.',
  },
};

/** Always on the helper's safety page, whatever the collection holds. */
export const GENERAL_SAFETY = [
  'These are husbandry reminders, not veterinary or medical advice.',
  'Some species need a licence or permit where you are: local law and licensed practice come first.',
  'After any bite or sting, wash the area, and seek medical advice — sooner if you feel unwell, have trouble breathing or the pain spreads. Take the species name with you.',
  'If hairs get into an eye, do not rub it: rinse with clean water and see a doctor.',
  'If an animal escapes: close the room door, keep pets and children out, and search slowly with a catch cup and a card; call the keeper.',
];

/** How to do each task, for someone who has not done it before (common practice, no published source). */
export const TASK_HOW: Record<TaskKind, string> = {
  feed: 'Hold the prey with long tongs by its back end, head towards the animal, and let it go a short way in front of it. Do not put your hand in. Close the lid. If it is not eaten, record “Prey left in”: the round tells you when to take it out (by the next day for slings and molting animals).',
  remove_prey:
    'Take out the uneaten prey with tongs, even if it is dead. Live prey left with a molting animal can injure it.',
  water:
    'Top up the water dish with clean water to just below the rim (the round asks every few days). Do not pour over the animal.',
  mist: 'Mist one wall of the enclosure lightly with clean water, away from the animal — a few droplets to drink, not a soaking. Never spray the animal itself, and keep the lid open as briefly as you can.',
  moisten:
    'Pour a little water into one corner of the substrate, away from the animal and its burrow, so part stays damp and part dry. No puddles: a small animal can drown in one.',
  spot_clean:
    'With long tongs, pick out the bolus (the dark ball of prey remains), dead prey, droppings and old molts. Do not put your hand in, do not break the web or the burrow, and close the lid at once.',
  rehouse:
    'Keepers only. Work over a large tub or a bath with the plug in, have the new enclosure ready and open, and coax the animal into a catch cup with a soft brush — never by hand. Fast or defensive animals can bite, sting or flick hairs: wear eye protection near hair-flicking species.',
  check:
    'Look without disturbing: note anything odd (a molt, a web-closed burrow, a mat of silk) and record it. For a beetle larva, check the food substrate is moist and not used up, top it up, and tap “Checked”.',
  leave_alone:
    'Do not open the enclosure or feed: it is molting, guarding eggs or young, or a pupa. Just look, and note anything odd.',
};
