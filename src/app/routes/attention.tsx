import { AttentionList } from '@/features/sync/components/attention-list';
import { useShell } from './shell';

export function AttentionRoute() {
  const { me } = useShell();
  return (
    <div className="flex flex-col gap-3">
      <h1 className="text-3xl font-extrabold">Needs attention</h1>
      <p>These taps were refused by Rackside and are not in the records. Record them again if they still apply, or tell a keeper.</p>
      <AttentionList userId={me.user.id} />
    </div>
  );
}
