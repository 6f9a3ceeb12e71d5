import { NoCollection } from '@/app/layout/no-collection';
import { useShell } from '@/app/layout/use-shell';
import { RoundChecklist } from '@/features/rounds/components/round-checklist';

/** Today's round as a sheet to print and tick at the rack (everyone who has a round). */
export function TodayChecklistRoute() {
  const { me, collection } = useShell();
  if (!collection) return <NoCollection />;
  return <RoundChecklist userId={me.user.id} collectionId={collection.collectionId} />;
}
