import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { EVENT_WORDS } from '#shared/domain/event-kinds';
import { describeInstant } from '#shared/domain/local-dates';
import { Button } from '@/components/ui/button';
import { Loading } from '@/components/ui/spinner';
import { withDb } from '@/lib/db';
import { attentionOf, dismissAttention } from '@/lib/outbox';
import { refreshSyncCounts } from '@/lib/sync-driver';

const key = (userId: string) => ['sync', 'attention', userId] as const;

/** Taps the server refused, with its reason, kept until the keeper has read them. */
export function AttentionList({ userId }: { userId: string }) {
  const queryClient = useQueryClient();
  const list = useQuery({ queryKey: key(userId), queryFn: () => withDb((db) => attentionOf(db, userId)), networkMode: 'always' });
  const dismiss = useMutation({
    mutationFn: (id: string) => withDb((db) => dismissAttention(db, id)),
    networkMode: 'always',
    onSuccess: () => {
      refreshSyncCounts();
      return queryClient.invalidateQueries({ queryKey: key(userId) });
    },
  });
  if (list.isPending) return <Loading />;
  if (!list.data?.length) return <p className="text-muted">Nothing needs attention. Every tap was saved.</p>;
  return (
    <ul className="flex flex-col gap-3">
      {list.data.map((a) => (
        <li key={a.id} className="flex flex-col gap-2 rounded-2xl border-2 border-danger bg-surface p-3">
          <p className="text-lg font-extrabold">
            {EVENT_WORDS[a.event.kind]} · {a.animalName}
          </p>
          <p className="text-sm text-muted">Tapped {describeInstant(a.event.clientRecordedAt)} · not saved</p>
          <p className="font-bold text-danger">{a.message}</p>
          <Button variant="secondary" onClick={() => dismiss.mutate(a.id)}>
            I have read this
          </Button>
        </li>
      ))}
    </ul>
  );
}
