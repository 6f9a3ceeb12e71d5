import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { localDateOf } from '#shared/domain/local-dates';
import { useColonies, useRecordColonyChore } from '@/features/colonies/api/colonies-api';
import { ColonyChores } from '@/features/colonies/components/colony-chores';
import { localRoundQueryOptions } from '@/features/rounds/api/get-round';
import { useChoresOn } from '@/lib/use-chores';
import { PrepListPanel } from './prep-list-panel';

/**
 * Keepers' extras on Today: the colonies' care due today (one tap each, offline like the
 * round's taps) and today's prep list with the colonies' draw. A collection without colonies
 * gets neither section's colony parts: the prep list reads as it always did.
 */
export default function TodayColoniesPanel({
  userId,
  collectionId,
  timeZone,
}: {
  userId: string;
  collectionId: string;
  timeZone: string;
}) {
  const today = localDateOf(new Date(), timeZone);
  const colonies = useColonies(collectionId);
  const chores = useChoresOn(collectionId, today);
  const { record, discard } = useRecordColonyChore(userId, collectionId, today);
  // The phone's copy of today's round only: the round panel keeps it fresh.
  const round = useQuery(localRoundQueryOptions(userId, collectionId, 'today'));
  const list = colonies.data?.colonies ?? [];
  const prep = round.data?.round.prepList ?? [];
  return (
    <>
      {list.length > 0 && (
        <section aria-labelledby="colonies-heading" className="flex flex-col gap-2">
          <div className="flex items-baseline justify-between gap-2">
            <h2 id="colonies-heading" className="text-xl font-extrabold">
              Colonies
            </h2>
            <Link
              to="/colonies"
              className="inline-flex min-h-target items-center font-bold underline underline-offset-4"
            >
              All colonies
            </Link>
          </div>
          <ColonyChores
            colonies={list}
            today={today}
            timeZone={timeZone}
            chores={(chores.data ?? []).filter((c) => c.chore.subjectKind === 'colony')}
            onDo={(id, kind) => void record(id, kind)}
            onDiscard={(id) => void discard(id)}
          />
        </section>
      )}
      {prep.length > 0 && (
        <details className="rounded-2xl border-2 border-border bg-surface p-3">
          <summary className="flex min-h-target cursor-pointer items-center justify-between gap-2 text-xl font-extrabold">
            Today’s prep list
            <span aria-hidden="true" className="text-base font-bold underline underline-offset-4">
              Show
            </span>
          </summary>
          <PrepListPanel collectionId={collectionId} lines={prep} />
        </details>
      )}
    </>
  );
}
