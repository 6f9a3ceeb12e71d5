import { useState } from 'react';
import {
  placeCode,
  placeTree,
  rackName,
  shelfName,
  spotChoice,
  type PlaceLevel,
  type PlaceParts,
} from '#shared/domain/places';
import type { LocationWithCount } from '#shared/schemas/locations';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';

/** The place being chosen, by name: '' where nothing is chosen yet. */
export type PlaceChoice = PlaceParts;
export const NO_CHOICE: PlaceChoice = { room: '', rack: '', shelf: '', position: '' };
const NEW = '\u0000new';
const LEVELS = ['room', 'rack', 'shelf', 'position'] as const;
const WORD: Record<PlaceLevel, string> = {
  room: 'Room',
  rack: 'Rack',
  shelf: 'Shelf or tray',
  position: 'Position',
};
const NEW_WORD: Record<PlaceLevel, string> = {
  room: '＋ New room…',
  rack: '＋ New rack…',
  shelf: '＋ New shelf or tray…',
  position: '＋ New position…',
};

/** The place's row when it exists already. */
export function existingPlace(places: readonly LocationWithCount[], c: PlaceChoice) {
  return places.find(
    (l) =>
      l.room === c.room && l.rack === c.rack && l.shelf === c.shelf && l.position === c.position,
  );
}

/** The active animals living in a spot, leaving out the ones being moved. */
export function occupantsAt(
  places: readonly LocationWithCount[],
  c: PlaceChoice,
  leaving: readonly string[] = [],
): string[] {
  const spot = existingPlace(places, c);
  return (spot?.occupants ?? []).filter((o) => !leaving.includes(o.id)).map((o) => o.name);
}

/** A place as it is first shown: the animal's own, else the first of the walk. */
export function choiceOf(p: PlaceParts | null | undefined): PlaceChoice {
  return p ? { room: p.room, rack: p.rack, shelf: p.shelf, position: p.position } : NO_CHOICE;
}

/**
 * Room → rack → shelf → position, each picked from what the collection has or named anew. Spots
 * say who lives there ("B2-1 · taken by Rosie"). With `to="shelf"` the position is left to the
 * caller (a pot-up numbers its own run).
 */
export function PlacePicker({
  legend,
  places,
  value,
  onChange,
  to = 'position',
  leaving = [],
  optional = false,
  errors = {},
}: {
  legend: string;
  places: readonly LocationWithCount[];
  value: PlaceChoice;
  onChange: (next: PlaceChoice) => void;
  to?: 'shelf' | 'position';
  /** Animals being moved: a spot they alone live in counts as free. */
  leaving?: readonly string[];
  /** "No place yet" is a choice (a new animal). */
  optional?: boolean;
  errors?: Partial<Record<PlaceLevel, string>>;
}) {
  const [typing, setTyping] = useState<Partial<Record<PlaceLevel, boolean>>>({});
  const tree = placeTree(places);
  const room = tree.find((r) => r.room === value.room);
  const rack = room?.racks.find((r) => r.rack === value.rack);
  const shelf = rack?.shelves.find((s) => s.shelf === value.shelf);
  const names: Record<PlaceLevel, string[]> = {
    room: tree.map((r) => r.room),
    rack: room?.racks.map((r) => r.rack) ?? [],
    shelf: rack?.shelves.map((s) => s.shelf) ?? [],
    position: shelf?.spots.map((s) => s.position) ?? [],
  };
  const levels = LEVELS.slice(0, to === 'shelf' ? 3 : 4);

  /** A level changed: the ones below it start again (their first name, when there is one). */
  function pick(level: PlaceLevel, name: string, typed: boolean) {
    const next = { ...value, [level]: name };
    const below = LEVELS.slice(LEVELS.indexOf(level) + 1);
    for (const l of below) next[l] = '';
    setTyping((t) => {
      const out = { ...t, [level]: typed };
      // Under a new group every level is new.
      for (const l of below) out[l] = typed;
      return out;
    });
    onChange(next);
  }

  const label = (level: PlaceLevel, name: string) => {
    if (level === 'rack') return rackName(name);
    if (level === 'shelf') return shelfName(name);
    if (level === 'position') {
      const spot = shelf?.spots.find((s) => s.position === name);
      const names = (spot?.occupants ?? []).filter((o) => !leaving.includes(o.id));
      return spot
        ? spotChoice(
            spot,
            names.map((o) => o.name),
          )
        : name;
    }
    return name;
  };

  return (
    <fieldset className="flex min-w-0 flex-col gap-2 rounded-2xl border-2 border-border p-3">
      <legend className="px-1 font-extrabold">{legend}</legend>
      {levels.map((level, i) => {
        const above = levels.slice(0, i);
        if (optional && level !== 'room' && !value.room && !typing.room) return null;
        if (above.some((l) => !value[l] && !typing[l])) return null;
        const choices = names[level];
        const typed = typing[level] || choices.length === 0;
        if (typed)
          return (
            <div key={level} className="flex flex-col gap-1">
              <TextField
                label={`${WORD[level]} (new)`}
                value={value[level]}
                error={errors[level]}
                autoComplete="off"
                onChange={(e) => onChange({ ...value, [level]: e.target.value })}
              />
              {choices.length > 0 && (
                <Button
                  variant="quiet"
                  className="self-start"
                  onClick={() => pick(level, choices[0]!, false)}
                >
                  Choose an existing {WORD[level].toLowerCase()}
                </Button>
              )}
            </div>
          );
        return (
          <SelectField
            key={level}
            label={WORD[level]}
            value={value[level]}
            error={errors[level]}
            onChange={(e) =>
              e.target.value === NEW ? pick(level, '', true) : pick(level, e.target.value, false)
            }
            options={[
              ...(optional && level === 'room'
                ? [{ value: '', label: 'No place yet' }]
                : value[level] === ''
                  ? [{ value: '', label: `Choose a ${WORD[level].toLowerCase()}` }]
                  : []),
              ...choices.map((n) => ({ value: n, label: label(level, n) })),
              { value: NEW, label: NEW_WORD[level] },
            ]}
          />
        );
      })}
    </fieldset>
  );
}

/** "B2-1 is taken by Rosie." and a tick to share it anyway; nothing for a free spot. */
export function TakenSpot({
  where,
  names,
  share,
  onShare,
  error,
}: {
  where: PlaceParts;
  names: readonly string[];
  share: boolean;
  onShare: (ok: boolean) => void;
  error?: string;
}) {
  if (!names.length) return null;
  return (
    <div className="flex flex-col gap-2 rounded-xl border-2 border-accent bg-surface p-3">
      <p className="font-bold text-accent">
        <span aria-hidden="true">! </span>
        {placeCode(where)} is taken by {names.join(', ')}.
      </p>
      <label className="flex min-h-target cursor-pointer items-center gap-3 font-bold">
        <input
          type="checkbox"
          className="size-6 accent-[var(--c-primary)]"
          checked={share}
          aria-invalid={error ? true : undefined}
          onChange={(e) => onShare(e.target.checked)}
        />
        Share the spot anyway (a communal or divided enclosure)
      </label>
      {error && (
        <p className="text-sm font-bold text-danger">
          <span aria-hidden="true">⚠ </span>
          {error}
        </p>
      )}
    </div>
  );
}

/** What is missing from a choice, level by level, in words for the form. */
export function choiceProblems(
  c: PlaceChoice,
  to: 'shelf' | 'position' = 'position',
): Partial<Record<PlaceLevel, string>> {
  const out: Partial<Record<PlaceLevel, string>> = {};
  for (const level of LEVELS.slice(0, to === 'shelf' ? 3 : 4))
    if (!c[level].trim()) out[level] = `Choose or name the ${WORD[level].toLowerCase()}.`;
  return out;
}
