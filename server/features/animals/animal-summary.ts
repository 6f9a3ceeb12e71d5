import type { Caution } from '#shared/domain/animal-facts';
import { toLocationSummary, type AnimalSummary } from '#shared/schemas/animals';
import type { AnimalRow, LocationRow } from './animals.repository';

/** A stored animal (and its place) as the API and the round engine see it. */
export function toAnimalSummary(a: AnimalRow, l: LocationRow | null): AnimalSummary {
  return {
    id: a.id,
    labelCode: a.labelCode,
    name: a.name,
    scientificName: a.scientificName,
    commonName: a.commonName,
    group: a.group,
    lifeStage: a.lifeStage,
    sex: a.sex,
    sizeMm: a.sizeMm,
    status: a.status,
    cautions: a.cautions as Caution[],
    location: toLocationSummary(l),
    hasWaterDish: a.hasWaterDish,
    intervalDays: a.intervalDays,
    mistEveryDays: a.mistEveryDays,
    moistenEveryDays: a.moistenEveryDays,
    spotCleanEveryDays: a.spotCleanEveryDays,
    enclosureLengthMm: a.enclosureLengthMm,
    enclosureWidthMm: a.enclosureWidthMm,
    enclosureHeightMm: a.enclosureHeightMm,
    preyType: a.preyType,
    preySize: a.preySize,
    preyCount: a.preyCount,
    diet: a.diet,
    doNotFeedUntil: a.doNotFeedUntil,
    statusDate: a.statusDate,
    acquiredOn: a.acquiredOn,
    source: a.source,
    cautionNote: a.cautionNote,
    notes: a.notes,
    clutch: a.clutch,
    photoVersion: a.photoUpdatedAt?.toISOString() ?? null,
    addedAt: a.createdAt.toISOString(),
  };
}
