import type { AnimalStatus, AnimalGroup, Caution, LifeStage } from '#shared/domain/animal-facts';
import { codeKey } from '#shared/domain/labels/label-payload';
import type { AnimalSummary } from '#shared/schemas/animals';

export interface TableFilters {
  search: string;
  stage: LifeStage | '';
  group: AnimalGroup | '';
  /** "kept" is every animal still in the collection (active); "" is all. */
  status: AnimalStatus | 'kept' | '';
  rack: string;
  caution: Caution | '';
  dueToday: boolean;
}
export const NO_FILTERS: TableFilters = {
  search: '',
  stage: '',
  group: '',
  status: 'kept',
  rack: '',
  caution: '',
  dueToday: false,
};

/** How many filters narrow the list now (the search box is counted apart: it is always shown). */
export function activeFilterCount(f: TableFilters): number {
  return (
    [f.stage, f.group, f.rack, f.caution].filter(Boolean).length +
    (f.status !== NO_FILTERS.status ? 1 : 0) +
    (f.dueToday ? 1 : 0)
  );
}

/** One pass over the list: cheap enough for every keystroke at 5,000 animals (T1). */
export function filterAnimals(
  animals: readonly AnimalSummary[],
  f: TableFilters,
  dueToday: ReadonlySet<string>,
): AnimalSummary[] {
  const words = f.search.trim().toLocaleLowerCase();
  const code = codeKey(f.search);
  return animals.filter(
    (a) =>
      (!f.stage || a.lifeStage === f.stage) &&
      (!f.group || a.group === f.group) &&
      (f.status === '' || (f.status === 'kept' ? a.status === 'active' : a.status === f.status)) &&
      (!f.rack || a.location?.rack === f.rack) &&
      (!f.caution || a.cautions.includes(f.caution)) &&
      (!f.dueToday || dueToday.has(a.id)) &&
      (!words ||
        (code.length > 0 && codeKey(a.labelCode).includes(code)) ||
        a.name.toLocaleLowerCase().includes(words) ||
        a.scientificName.toLocaleLowerCase().includes(words) ||
        (a.commonName?.toLocaleLowerCase().includes(words) ?? false)),
  );
}
