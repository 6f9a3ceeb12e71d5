import { EVENT_WORDS, type EventKind } from '#shared/domain/event-kinds';
import { describeInstant } from '#shared/domain/local-dates';
import { TASK_HOW } from '#shared/domain/safety';
import type { HelperCoverView } from '#shared/schemas/cover';
import type { RoundItemView } from '#shared/schemas/rounds';

/**
 * On each item of a helper's round: the keeper's notes, how, and the last two weeks. The
 * cautions are spelled out once at the top of the round (RoundCautions); the card has badges.
 */
export function HelperItemExtras({
  item,
  cover,
  timeZone,
}: {
  item: RoundItemView;
  cover: HelperCoverView;
  timeZone: string;
}) {
  const notes = cover.notes.filter((n) => n.animalId === item.animal.id);
  const recent = cover.recent[item.animal.id] ?? [];
  return (
    <div className="flex flex-col gap-2">
      {notes.map((n) => (
        <p key={n.id} className="rounded-xl border-2 border-accent px-2 py-1">
          <span className="font-extrabold">
            Keeper’s note{n.doNotFeed ? ' · do not feed' : ''}:
          </span>{' '}
          {n.text}
        </p>
      ))}
      <details className="rounded-xl border-2 border-border px-2">
        <summary className="flex min-h-target cursor-pointer items-center font-bold">
          How to do this
        </summary>
        <ul className="flex flex-col gap-1 pb-2">
          {item.tasks.map((t) => (
            <li key={t.kind}>{TASK_HOW[t.kind]}</li>
          ))}
        </ul>
      </details>
      {recent.length > 0 && (
        <details className="rounded-xl border-2 border-border px-2">
          <summary className="flex min-h-target cursor-pointer items-center font-bold">
            Last 14 days ({recent.length})
          </summary>
          <ul className="pb-2 text-sm">
            {recent.map((r, i) => (
              <li key={i}>
                {describeInstant(r.at, timeZone)} · {EVENT_WORDS[r.kind as EventKind] ?? r.kind}
                {r.by && ` · ${r.by}`}
              </li>
            ))}
          </ul>
        </details>
      )}
    </div>
  );
}
