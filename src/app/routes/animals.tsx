import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { AnimalList } from '@/features/animals/components/animal-list';
import { useShell } from './shell';

export function AnimalsRoute() {
  const { collection } = useShell();
  const [choosing, setChoosing] = useState(false);
  const [chosen, setChosen] = useState<Set<string>>(new Set());
  if (!collection) return <Notice tone="info" title="You are not in any collection yet." />;
  const toggle = (id: string) =>
    setChosen((prev) => {
      const next = new Set(prev);
      if (!next.delete(id)) next.add(id);
      return next;
    });
  return (
    <div className="flex flex-col gap-3">
      <h1 className="text-3xl font-extrabold">Animals</h1>
      <div className="flex flex-wrap gap-2">
        {choosing ? (
          <>
            <Link
              to="/labels"
              state={{ animalIds: [...chosen] }}
              aria-disabled={chosen.size === 0}
              className={`inline-flex min-h-target items-center rounded-xl border-2 border-primary bg-primary px-4 text-lg font-bold text-on-primary ${chosen.size ? '' : 'pointer-events-none opacity-60'}`}
            >
              Print {chosen.size} {chosen.size === 1 ? 'label' : 'labels'}
            </Link>
            <Button variant="quiet" onClick={() => (setChoosing(false), setChosen(new Set()))}>
              Cancel
            </Button>
          </>
        ) : (
          <>
            <Button variant="secondary" onClick={() => setChoosing(true)}>
              Choose for labels
            </Button>
            <Link to="/labels" className="inline-flex min-h-target items-center rounded-xl border-2 border-border px-4 text-lg font-bold">
              Labels…
            </Link>
          </>
        )}
      </div>
      <AnimalList collectionId={collection.collectionId} searchable selection={choosing ? { chosen, onToggle: toggle } : undefined} />
    </div>
  );
}
