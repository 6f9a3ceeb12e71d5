import { useDeferredValue, useMemo, useState } from 'react';
import type { AnimalSummary } from '#shared/schemas/animals';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { TextField } from '@/components/ui/text-field';
import { useAnimalList } from '../api/list-animals';
import { AnimalCard } from './animal-card';

function groupLabel(a: AnimalSummary): string {
  if (!a.location) return 'Without a place';
  return `${a.location.room} · Rack ${a.location.rack} · Shelf ${a.location.shelf}`;
}

/** The collection's animals in walk order, grouped by shelf, with a search box. */
interface Props {
  collectionId: string;
  searchable?: boolean;
  /** Tick boxes beside each animal, e.g. to print their labels. */
  selection?: { chosen: ReadonlySet<string>; onToggle: (id: string) => void };
}

export function AnimalList({ collectionId, searchable = false, selection }: Props) {
  const animals = useAnimalList(collectionId);
  const [query, setQuery] = useState('');
  const deferred = useDeferredValue(query.trim().toLowerCase());

  const groups = useMemo(() => {
    const found = (animals.data?.animals ?? []).filter(
      (a) =>
        !deferred ||
        a.name.toLowerCase().includes(deferred) ||
        a.labelCode.toLowerCase().replace(/\s/g, '').includes(deferred.replace(/\s/g, '')) ||
        a.scientificName.toLowerCase().includes(deferred),
    );
    const map = new Map<string, AnimalSummary[]>();
    for (const a of found) map.set(groupLabel(a), [...(map.get(groupLabel(a)) ?? []), a]);
    return [...map.entries()];
  }, [animals.data, deferred]);

  if (animals.isPending) return <Loading label="Loading animals…" />;
  if (animals.isError) return <Notice tone="error" title={animals.error.message} />;

  const total = animals.data.animals.length;
  return (
    <div className="flex flex-col gap-4">
      {searchable && (
        <TextField label="Find an animal" type="search" placeholder="Name, code or species" value={query} onChange={(e) => setQuery(e.target.value)} />
      )}
      <p className="text-muted" aria-live="polite">
        {total === 0 ? 'No animals yet.' : `${groups.reduce((n, [, list]) => n + list.length, 0)} of ${total} animals`}
      </p>
      {groups.map(([label, list]) => (
        <section key={label} aria-label={label} className="flex flex-col gap-2">
          <h2 className="sticky top-0 z-10 bg-bg py-1 text-lg font-extrabold">{label}</h2>
          {list.map((a) =>
            selection ? (
              <div key={a.id} className="flex items-center gap-2">
                <label className="flex min-h-target min-w-target cursor-pointer items-center justify-center has-[:focus-visible]:outline has-[:focus-visible]:outline-4">
                  <input type="checkbox" checked={selection.chosen.has(a.id)} onChange={() => selection.onToggle(a.id)} className="size-6 accent-[var(--c-primary)]" />
                  <span className="sr-only">Choose {a.name}</span>
                </label>
                <div className="min-w-0 flex-1">
                  <AnimalCard animal={a} linked />
                </div>
              </div>
            ) : (
              <AnimalCard key={a.id} animal={a} linked />
            ),
          )}
        </section>
      ))}
    </div>
  );
}
