import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { EVENT_WORDS } from '#shared/domain/event-kinds';
import { describeInstant } from '#shared/domain/local-dates';
import { Button } from '@/components/ui/button';
import { Loading } from '@/components/ui/spinner';
import { withDb, type AttentionEntry } from '@/lib/db';
import { attentionOf, discardAttention, resendAttention } from '@/lib/outbox';
import { queryKeys } from '@/lib/query-keys';
import { refreshSyncCounts, syncNow } from '@/lib/sync-driver';

/**
 * Taps the server refused, with its reason. Each stays until the person sends it again (same
 * event id, so it can never be stored twice) or discards it after a second "are you sure".
 */
export function AttentionList({ userId }: { userId: string }) {
  const queryClient = useQueryClient();
  const list = useQuery({
    queryKey: queryKeys.sync.attention(userId),
    queryFn: () => withDb((db) => attentionOf(db, userId)),
    networkMode: 'always',
  });
  const changed = () => {
    refreshSyncCounts();
    return queryClient.invalidateQueries({ queryKey: queryKeys.sync.attention(userId) });
  };
  const resend = useMutation({
    mutationFn: (id: string) => withDb((db) => resendAttention(db, id)),
    networkMode: 'always',
    onSuccess: async () => {
      await changed();
      void syncNow();
    },
  });
  const discard = useMutation({
    mutationFn: (id: string) => withDb((db) => discardAttention(db, id)),
    networkMode: 'always',
    onSuccess: changed,
  });
  if (list.isPending) return <Loading />;
  if (!list.data?.length)
    return <p className="text-muted">Nothing needs attention. Every tap was saved.</p>;
  return (
    <ul className="flex flex-col gap-3">
      {list.data.map((a) => (
        <AttentionItem
          key={a.id}
          entry={a}
          busy={resend.isPending || discard.isPending}
          onResend={() => resend.mutate(a.id)}
          onDiscard={() => discard.mutate(a.id)}
        />
      ))}
    </ul>
  );
}

function AttentionItem({
  entry: a,
  busy,
  onResend,
  onDiscard,
}: {
  entry: AttentionEntry;
  busy: boolean;
  onResend: () => void;
  onDiscard: () => void;
}) {
  const [confirming, setConfirming] = useState(false);
  const what = `${EVENT_WORDS[a.event.kind]} · ${a.animalName}`;
  return (
    <li className="flex flex-col gap-2 rounded-2xl border-2 border-danger bg-surface p-3">
      <p className="text-lg font-extrabold">{what}</p>
      <p className="text-sm text-muted">
        Tapped {describeInstant(a.event.clientRecordedAt)} · not saved
      </p>
      <p className="font-bold text-danger">{a.message}</p>
      {confirming ? (
        <div
          role="group"
          aria-label={`Discard ${what}?`}
          className="flex flex-col gap-2 rounded-xl border-2 border-accent p-2"
        >
          <p className="font-bold">
            Discard this tap? It is not in the records and will not be sent.
          </p>
          <Button variant="danger" busy={busy} onClick={onDiscard}>
            Discard for good
          </Button>
          <Button variant="secondary" onClick={() => setConfirming(false)}>
            Keep it
          </Button>
        </div>
      ) : (
        <div className="flex flex-wrap gap-2">
          <Button busy={busy} onClick={onResend}>
            Send again
          </Button>
          <Button variant="danger" onClick={() => setConfirming(true)}>
            Discard…
          </Button>
        </div>
      )}
    </li>
  );
}
