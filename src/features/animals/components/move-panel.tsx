import { useState } from 'react';
import type { LocationWithCount } from '#shared/schemas/locations';
import {
  choiceOf,
  choiceProblems,
  existingPlace,
  occupantsAt,
  PlacePicker,
  TakenSpot,
  type PlaceChoice,
} from '@/components/place-picker';
import { Notice } from '@/components/ui/notice';
import { PanelActions } from './panel-actions';

/**
 * Moves one animal or many to one place, picked from the tree of places or named anew; each
 * move is kept in the animal's history. A taken spot is said so, and shared only when ticked.
 * "Into a new enclosure" marks a rehouse, which starts a settling period (docs/care-rules.md § R16).
 */
export function MovePanel({
  what,
  locations,
  current,
  moving,
  onCreatePlace,
  onMove,
  onCancel,
}: {
  what: string;
  locations: readonly LocationWithCount[];
  current?: string | null;
  /** The animals being moved: a spot they alone live in is free for them. */
  moving: readonly string[];
  /** A place named in the picker that does not exist yet: created first, its id returned. */
  onCreatePlace: (place: PlaceChoice) => Promise<string>;
  onMove: (locationId: string, rehoused: boolean) => Promise<unknown>;
  onCancel: () => void;
}) {
  const start = locations.find((l) => l.id === current) ?? null;
  const [choice, setChoice] = useState<PlaceChoice>(choiceOf(start));
  const [rehoused, setRehoused] = useState(false);
  const [share, setShare] = useState(false);
  const [tried, setTried] = useState(false);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const taken = occupantsAt(locations, choice, moving);
  const missing = choiceProblems(choice);
  const mustShare = taken.length > 0 && !share;

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setTried(true);
    if (Object.keys(missing).length || mustShare) return;
    setBusy(true);
    setProblem(null);
    try {
      const id = existingPlace(locations, choice)?.id ?? (await onCreatePlace(choice));
      await onMove(id, rehoused);
    } catch (err) {
      setProblem(err instanceof Error ? err.message : String(err));
    } finally {
      setBusy(false);
    }
  }

  return (
    <form
      aria-label={`Move ${what}`}
      className="flex flex-col gap-3 rounded-2xl border-2 border-border bg-surface p-3"
      onSubmit={submit}
      noValidate
    >
      {!locations.length && (
        <Notice
          tone="info"
          title="No places yet: name the first one below, or add them under Places."
        />
      )}
      <PlacePicker
        legend={`Move ${what} to`}
        places={locations}
        value={choice}
        onChange={(c) => {
          setChoice(c);
          setShare(false);
        }}
        leaving={moving}
        errors={tried ? missing : {}}
      />
      <TakenSpot
        where={choice}
        names={taken}
        share={share}
        onShare={setShare}
        error={tried && mustShare ? 'Tick to share the spot, or choose a free one.' : undefined}
      />
      <label className="flex min-h-target cursor-pointer items-center gap-3 font-bold">
        <input
          type="checkbox"
          className="size-6 accent-[var(--c-primary)]"
          checked={rehoused}
          onChange={(e) => setRehoused(e.target.checked)}
        />
        Into a new enclosure (no food for a few days while it settles)
      </label>
      <PanelActions word="Move" busy={busy} error={problem} onCancel={onCancel} />
    </form>
  );
}
