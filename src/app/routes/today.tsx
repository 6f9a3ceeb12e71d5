import { describeLocalDate } from '#shared/domain/local-dates';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { useTodayRound } from '@/features/rounds/api/get-today-round';
import { ProgressBar } from '@/features/rounds/components/progress-bar';
import { RoundList } from '@/features/rounds/components/round-list';
import { useShell } from './shell';

export function TodayRoute() {
  const { collection } = useShell();
  if (!collection) return <Notice tone="info" title="You are not in any collection yet." />;
  return <TodayRound collectionId={collection.collectionId} />;
}

function TodayRound({ collectionId }: { collectionId: string }) {
  const round = useTodayRound(collectionId);
  if (round.isPending) return <Loading label="Loading today’s round…" />;
  if (round.isError) return <Notice tone="error" title={round.error.message} />;
  const r = round.data;
  return (
    <div className="flex flex-col gap-3">
      <h1 className="text-3xl font-extrabold">Today · {describeLocalDate(r.date)}</h1>
      <ProgressBar done={r.progress.done} total={r.progress.total} />
      <RoundList items={r.items} />
    </div>
  );
}
