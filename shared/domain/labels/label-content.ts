import {
  SEX_LABEL,
  STAGE_LABEL,
  stageLabel,
  type AnimalGroup,
  type Caution,
  type LifeStage,
  type Sex,
} from '../animal-facts';
import {
  LABEL_FIELDS,
  labelLayout,
  MIN_MODULE_MM,
  type LabelField,
  type LabelLayout,
} from './label-layout';
import { LABEL_TAG_LENGTH, labelUrl, shortLabelPayload } from './label-payload';
import { makeQrSymbol, type QrSymbol } from './qr-symbol';
import type { LabelSize } from './sheet-layout';

export interface LabelAnimal {
  id: string;
  labelCode: string;
  name: string;
  scientificName: string;
  lifeStage: LifeStage;
  /** Names the stage in the group's words ("Nymph L1–L3"); the generic name without it. */
  group?: AnimalGroup;
  sex: Sex;
  cautions: readonly Caution[];
}

/** Everything one printed label shows, the same in the browser print and the server PDF. */
export interface LabelContent {
  animalId: string;
  code: string;
  /** What the QR holds: the label's address, or `L/TAG/CODE` where no address fits. */
  url: string;
  /** The QR holds the short form: only Rackside's own scanner opens it. */
  short: boolean;
  name: string;
  scientificName: string;
  stage: string;
  cautions: readonly Caution[];
  symbol: QrSymbol;
  layout: LabelLayout;
}

export function labelContent(
  animal: LabelAnimal,
  tag: string,
  origin: string,
  size: LabelSize,
  fields: readonly LabelField[],
): LabelContent {
  const {
    payload: url,
    symbol,
    layout,
    short,
  } = chooseSymbol(
    labelUrl(origin, tag, animal.labelCode),
    shortLabelPayload(tag, animal.labelCode),
    size,
    fields,
  );
  const stage = animal.group
    ? stageLabel(animal.group, animal.lifeStage)
    : STAGE_LABEL[animal.lifeStage];
  return {
    animalId: animal.id,
    code: animal.labelCode,
    url,
    short,
    name: animal.name,
    scientificName: animal.scientificName,
    stage: animal.sex === 'unknown' ? stage : `${stage} · ${SEX_LABEL[animal.sex]}`,
    cautions: animal.cautions,
    symbol,
    layout,
  };
}

/**
 * The label's address when its QR fits the label with modules of MIN_MODULE_MM or more (any
 * phone camera opens it); else the short form, when that fits (a 19 mm square).
 */
function chooseSymbol(
  full: string,
  brief: string,
  size: LabelSize,
  fields: readonly LabelField[],
): { payload: string; symbol: QrSymbol; layout: LabelLayout; short: boolean } {
  const symbol = makeQrSymbol(full);
  const layout = labelLayout(size, symbol.size, fields);
  if (!layout.tooSmall) return { payload: full, symbol, layout, short: false };
  const small = makeQrSymbol(brief);
  const smallLayout = labelLayout(size, small.size, fields);
  return smallLayout.moduleMm > layout.moduleMm
    ? { payload: brief, symbol: small, layout: smallLayout, short: true }
    : { payload: full, symbol, layout, short: false };
}

/** What one size of label can carry, for the size picker. */
export interface LabelCapacity {
  /** The QR prints with modules of MIN_MODULE_MM or more. */
  fits: boolean;
  /** Its QR holds the short form: Rackside's scanner only, not a phone's own camera app. */
  short: boolean;
  /** The fields (besides the code) that fit with all of them asked for. */
  fields: LabelField[];
  moduleMm: number;
}

/**
 * What a size carries for this app's address, worked out for the longest code there can be
 * (a 4-character prefix and 5 after the dash: `isLabelCode`), so no label of the collection
 * carries less than the picker says.
 */
export function labelCapacity(size: LabelSize, origin: string): LabelCapacity {
  const tag = 'W'.repeat(LABEL_TAG_LENGTH);
  const longest: LabelAnimal = {
    id: 'capacity',
    labelCode: 'WWWW-WWWWW',
    name: '',
    scientificName: '',
    lifeStage: 'adult',
    sex: 'unknown',
    cautions: [],
  };
  const c = labelContent(longest, tag, origin, size, LABEL_FIELDS);
  return {
    fits: c.layout.moduleMm >= MIN_MODULE_MM,
    short: c.short,
    fields: LABEL_FIELDS.filter((f) => !c.layout.dropped.includes(f)),
    moduleMm: c.layout.moduleMm,
  };
}

/** Why a print cannot go ahead, in words for the keeper; null when it can. */
export function printProblem(labels: readonly LabelContent[]): string | null {
  const dense = labels.find((l) => l.layout.tooSmall);
  if (dense) {
    return `On this size the QR's squares would be ${dense.layout.moduleMm.toFixed(2)} mm, under the 0.5 mm that prints and scans reliably. Choose a larger label.`;
  }
  return null;
}
