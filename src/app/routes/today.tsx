import { describeLocalDate, localDateOf } from '#shared/domain/local-dates';
import { Notice } from '@/components/ui/notice';
import { AnimalList } from '@/features/animals/components/animal-list';
import { useShell } from './shell';

export function TodayRoute() {
  const { collection } = useShell();
  if (!collection) return <Notice tone="info" title="You are not in any collection yet." />;
  const today = describeLocalDate(localDateOf(new Date(), collection.timeZone));
  return (
    <div className="flex flex-col gap-3">
      <h1 className="text-3xl font-extrabold">Today · {today}</h1>
      <AnimalList collectionId={collection.collectionId} />
    </div>
  );
}
