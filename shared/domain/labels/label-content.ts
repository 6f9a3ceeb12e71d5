import {
  SEX_LABEL,
  STAGE_LABEL,
  stageLabel,
  type AnimalGroup,
  type Caution,
  type LifeStage,
  type Sex,
} from '../animal-facts';
import { labelLayout, type LabelField, type LabelLayout } from './label-layout';
import { labelUrl } from './label-payload';
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
  url: string;
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
  const url = labelUrl(origin, tag, animal.labelCode);
  const symbol = makeQrSymbol(url);
  const stage = animal.group
    ? stageLabel(animal.group, animal.lifeStage)
    : STAGE_LABEL[animal.lifeStage];
  return {
    animalId: animal.id,
    code: animal.labelCode,
    url,
    name: animal.name,
    scientificName: animal.scientificName,
    stage: animal.sex === 'unknown' ? stage : `${stage} · ${SEX_LABEL[animal.sex]}`,
    cautions: animal.cautions,
    symbol,
    layout: labelLayout(size, symbol.size, fields),
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
