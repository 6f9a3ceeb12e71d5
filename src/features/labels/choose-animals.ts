import { codeKey } from '#shared/domain/labels/label-payload';
import { localDateOf } from '#shared/domain/local-dates';
import type { AnimalSummary } from '#shared/schemas/animals';

/** Ways to pick the animals a sheet is for; empty fields do not filter. */
export interface AnimalPick {
  rack: string;
  /** A shelf or tray inside the rack ("1", "2"…). */
  shelf: string;
  clutch: string;
  /** YYYY-MM-DD: animals added on or after this day, in the collection's zone. */
  addedSince: string;
  search: string;
}
export const NO_PICK: AnimalPick = { rack: '', shelf: '', clutch: '', addedSince: '', search: '' };

export function pickAnimals(
  animals: readonly AnimalSummary[],
  pick: AnimalPick,
  timeZone: string,
): AnimalSummary[] {
  const words = pick.search.trim().toLocaleLowerCase();
  const code = codeKey(pick.search);
  return animals.filter((a) => {
    if (a.status !== 'active') return false;
    if (pick.rack && a.location?.rack !== pick.rack) return false;
    if (pick.shelf && a.location?.shelf !== pick.shelf) return false;
    if (pick.clutch && a.clutch !== pick.clutch) return false;
    if (pick.addedSince && localDateOf(new Date(a.addedAt), timeZone) < pick.addedSince)
      return false;
    if (!words) return true;
    return (
      (code.length > 0 && codeKey(a.labelCode).includes(code)) ||
      a.name.toLocaleLowerCase().includes(words) ||
      a.scientificName.toLocaleLowerCase().includes(words)
    );
  });
}

const sorted = (values: Iterable<string>) =>
  [...new Set(values)].sort((x, y) => x.localeCompare(y, undefined, { numeric: true }));

/** The choices the pickers offer, from the animals there are. */
export function pickChoices(animals: readonly AnimalSummary[], rack: string) {
  return {
    racks: sorted(animals.flatMap((a) => (a.location ? [a.location.rack] : []))),
    shelves: sorted(
      animals.flatMap((a) =>
        a.location && (!rack || a.location.rack === rack) ? [a.location.shelf] : [],
      ),
    ),
    clutches: sorted(animals.flatMap((a) => (a.clutch ? [a.clutch] : []))),
  };
}
