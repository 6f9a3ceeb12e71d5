import { useMemo, useState } from 'react';
import { stageLabel } from '#shared/domain/animal-facts';
import { rackAndShelf, rackName, shelfName } from '#shared/domain/places';
import type { AnimalSummary } from '#shared/schemas/animals';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { NO_PICK, pickAnimals, pickChoices, type AnimalPick } from '../choose-animals';

interface Props {
  animals: readonly AnimalSummary[];
  timeZone: string;
  chosen: ReadonlySet<string>;
  onChange: (chosen: Set<string>) => void;
}

const any = (word: string, values: string[], named = (v: string) => v) => [
  { value: '', label: word },
  ...values.map((v) => ({ value: v, label: named(v) })),
];

/** Narrow the list by rack, shelf or tray, clutch, date added or a search; tick the animals wanted. */
export function AnimalChooser({ animals, timeZone, chosen, onChange }: Props) {
  const [pick, setPick] = useState<AnimalPick>(NO_PICK);
  const choices = useMemo(() => pickChoices(animals, pick.rack), [animals, pick.rack]);
  const shown = useMemo(() => pickAnimals(animals, pick, timeZone), [animals, pick, timeZone]);
  const set = (patch: Partial<AnimalPick>) => setPick((p) => ({ ...p, ...patch }));
  const toggle = (id: string) => {
    const next = new Set(chosen);
    if (!next.delete(id)) next.add(id);
    onChange(next);
  };

  return (
    <section aria-labelledby="choose-heading" className="flex flex-col gap-3">
      <h2 id="choose-heading" className="text-xl font-extrabold">
        1 · Animals <span className="font-bold text-muted">({chosen.size} chosen)</span>
      </h2>
      <div className="grid grid-cols-2 gap-2">
        <SelectField
          label="Rack"
          value={pick.rack}
          onChange={(e) => set({ rack: e.target.value, shelf: '' })}
          options={any('Any rack', choices.racks, rackName)}
        />
        <SelectField
          label="Shelf or tray"
          value={pick.shelf}
          onChange={(e) => set({ shelf: e.target.value })}
          options={any('Any', choices.shelves, (s) =>
            pick.rack ? rackAndShelf({ rack: pick.rack, shelf: s }) : shelfName(s),
          )}
        />
        <SelectField
          label="Clutch"
          value={pick.clutch}
          onChange={(e) => set({ clutch: e.target.value })}
          options={any('Any clutch', choices.clutches)}
        />
        <TextField
          label="Added since"
          type="date"
          value={pick.addedSince}
          onChange={(e) => set({ addedSince: e.target.value })}
        />
      </div>
      <TextField
        label="Find"
        type="search"
        placeholder="Code, name or species"
        value={pick.search}
        onChange={(e) => set({ search: e.target.value })}
        autoComplete="off"
      />
      <div className="flex flex-wrap gap-2">
        <Button
          variant="secondary"
          onClick={() => onChange(new Set([...chosen, ...shown.map((a) => a.id)]))}
          disabled={!shown.length}
        >
          Choose all {shown.length} shown
        </Button>
        <Button variant="quiet" onClick={() => onChange(new Set())} disabled={!chosen.size}>
          Clear choice
        </Button>
      </div>
      <ul
        aria-label="Animals to label"
        className="flex max-h-96 flex-col gap-1 overflow-y-auto rounded-xl border-2 border-border p-1"
        tabIndex={0}
      >
        {shown.length === 0 && <li className="p-2 text-muted">No animal matches these choices.</li>}
        {shown.map((a) => (
          <li key={a.id}>
            <label className="flex min-h-target cursor-pointer items-center gap-3 rounded-lg px-2 has-[:focus-visible]:outline has-[:focus-visible]:outline-4">
              <input
                type="checkbox"
                checked={chosen.has(a.id)}
                onChange={() => toggle(a.id)}
                className="size-6 shrink-0 accent-[var(--c-primary)]"
              />
              <span className="font-mono font-bold tracking-wider">{a.labelCode}</span>
              <span className="truncate">
                {a.name}{' '}
                <span className="text-sm text-muted">· {stageLabel(a.group, a.lifeStage)}</span>
              </span>
            </label>
          </li>
        ))}
      </ul>
    </section>
  );
}
