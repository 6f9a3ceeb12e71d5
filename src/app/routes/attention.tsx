import { useShell } from '@/app/layout/use-shell';
import { AttentionList } from '@/features/sync/components/attention-list';

export function AttentionRoute() {
  const { me } = useShell();
  return (
    <div className="flex flex-col gap-3">
      <h1 className="text-3xl font-extrabold">Needs attention</h1>
      <p>
        Rackside refused these taps, so they are not in the records. Send one again once what
        stopped it has changed, or discard it if it no longer applies.
      </p>
      <AttentionList userId={me.user.id} />
    </div>
  );
}
