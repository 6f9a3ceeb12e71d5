import { useState } from 'react';
import { EVENT_WORDS } from '#shared/domain/event-kinds';
import { describeInstant } from '#shared/domain/local-dates';
import type { HistoryEvent } from '#shared/schemas/events';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { useAnimalHistory } from '../api/animal-history';
import { useRecordOutcome, type Recorder } from '../api/record-outcome';


function detail(e: HistoryEvent): string | null {
  const p = e.payload as { text?: string; note?: string; sizeMm?: number };
  return p.text ?? p.note ?? (p.sizeMm ? `${p.sizeMm} mm` : null);
}

/**
 * The animal's recent facts. A mistaken one is undone by recording a void, so the history
 * keeps both the mistake and its correction.
 */
export function AnimalHistory({ recorder, animal, timeZone }: { recorder: Recorder; animal: { id: string; name: string }; timeZone: string }) {
  const when = (iso: string) => describeInstant(iso, timeZone);
  const history = useAnimalHistory(recorder.collectionId, animal.id);
  const record = useRecordOutcome(recorder);
  const [undone, setUndone] = useState<Set<string>>(new Set());
  return (
    <section aria-labelledby="history-heading" className="flex flex-col gap-2">
      <h2 id="history-heading" className="text-xl font-extrabold">
        History
      </h2>
      {history.isPending && <Loading />}
      {history.isError && <Notice tone="error" title={history.error.message} />}
      {history.data && !history.data.events.length && <p className="text-muted">Nothing recorded yet.</p>}
      <ul className="flex flex-col gap-2">
        {history.data?.events
          .filter((e) => e.kind !== 'void')
          .map((e) => {
            const cancelled = !!e.voidedBy || undone.has(e.id);
            return (
              <li key={e.id} className="flex items-center gap-2 rounded-xl border-2 border-border bg-surface p-2">
                <div className="min-w-0 flex-1">
                  <p className={`font-bold ${cancelled ? 'line-through' : ''}`}>
                    {EVENT_WORDS[e.kind]}
                    {detail(e) && <span className="font-normal"> · {detail(e)}</span>}
                  </p>
                  <p className="text-sm text-muted">
                    {when(e.at)}
                    {e.by && ` · ${e.by}`}
                    {cancelled && ' · undone'}
                  </p>
                </div>
                {!cancelled && (
                  <Button
                    variant="secondary"
                    aria-label={`Undo ${EVENT_WORDS[e.kind]}, ${when(e.at)}`}
                    onClick={() => void record(animal, 'void', { targetId: e.id }).then(() => setUndone((s) => new Set(s).add(e.id)))}
                  >
                    Undo
                  </Button>
                )}
              </li>
            );
          })}
      </ul>
    </section>
  );
}
