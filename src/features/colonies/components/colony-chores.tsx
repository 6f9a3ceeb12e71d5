import { COLONY_CARE_WORDS, dueCare, type ColonyCareKind } from '#shared/domain/colonies/care';
import { clockTime } from '#shared/domain/local-dates';
import type { ColonyView } from '#shared/schemas/colonies';
import { Button } from '@/components/ui/button';
import type { ChoreEntry } from '@/lib/db';

/**
 * Today's colony care (docs/care-rules.md § Feeder colonies): each colony with something due,
 * one button per chore. A chore tapped on this phone shows done at once, sent or not; one the
 * server refused shows its words and can be discarded.
 */
export function ColonyChores({
  colonies,
  today,
  timeZone,
  chores,
  onDo,
  onDiscard,
}: {
  colonies: ColonyView[];
  today: string;
  timeZone: string;
  chores: ChoreEntry[];
  onDo: (colonyId: string, kind: ColonyCareKind) => void;
  onDiscard: (choreId: string) => void;
}) {
  const doneHere = (colonyId: string, kind: string) =>
    chores.find(
      (c) => c.chore.subjectId === colonyId && c.chore.kind === kind && c.state !== 'refused',
    );
  const cards = colonies
    .map((c) => {
      // Care done today stays listed, ticked: counted as if not done yet, shown done below.
      const beforeToday = Object.fromEntries(
        Object.entries(c.lastDone).map(([k, d]) => [k, d === today ? null : d]),
      );
      return { c, due: dueCare(c.intervals, beforeToday, today) };
    })
    .filter((x) => x.due.length > 0);
  const refused = chores.filter((c) => c.state === 'refused');
  if (!cards.length && !refused.length)
    return <p className="text-muted">No colony care due today.</p>;
  return (
    <div className="flex flex-col gap-3">
      {refused.map((r) => (
        <div key={r.id} role="alert" className="rounded-xl border-2 border-danger bg-surface p-3">
          <p className="font-bold text-danger">
            <span aria-hidden="true">⚠ </span>
            Not saved: {COLONY_CARE_WORDS[r.chore.kind as ColonyCareKind] ?? r.chore.kind}
          </p>
          <p>{r.message}</p>
          <Button variant="secondary" onClick={() => onDiscard(r.id)}>
            Discard
          </Button>
        </div>
      ))}
      {cards.map(({ c, due }) => (
        <div
          key={c.id}
          role="group"
          aria-labelledby={`colony-${c.id}`}
          className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3"
        >
          <h3 id={`colony-${c.id}`} className="text-lg font-extrabold">
            {c.name}
            {c.species && <span className="font-normal text-muted"> · {c.species}</span>}
          </h3>
          <ul className="grid grid-cols-2 gap-2">
            {due.map((d) => {
              const done = doneHere(c.id, d.kind) ?? null;
              const doneOnServer = c.lastDone[d.kind] === today;
              const word = COLONY_CARE_WORDS[d.kind];
              return (
                <li key={d.kind}>
                  {done || doneOnServer ? (
                    <p className="flex min-h-target items-center gap-2 rounded-xl border-2 border-ok px-3 font-bold text-ok">
                      <span aria-hidden="true">✓</span>
                      <span>
                        {word} done
                        {done && (
                          <span className="block text-sm font-normal text-text">
                            {clockTime(done.chore.clientRecordedAt, timeZone)}
                            {done.state === 'waiting' ? ' · on this phone' : ''}
                          </span>
                        )}
                      </span>
                    </p>
                  ) : (
                    <Button variant="secondary" wide onClick={() => onDo(c.id, d.kind)}>
                      {word}
                      <span className="sr-only">: {c.name}</span>
                      {d.overdueDays > 0 && (
                        <span className="text-sm font-normal"> · {d.overdueDays} d late</span>
                      )}
                    </Button>
                  )}
                </li>
              );
            })}
          </ul>
        </div>
      ))}
    </div>
  );
}
