import { useState } from 'react';
import type { CoverSummary } from '#shared/schemas/cover';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { TextField } from '@/components/ui/text-field';
import { useCoverChanges, useCovers } from '../api/cover-api';

const STATE_WORDS: Record<CoverSummary['state'], string> = { invited: 'Invited', upcoming: 'Starts soon', running: 'Running now', ended: 'Ended' };

/** The owner's covers: who, which days, and whether it runs; a new one by e-mail. */
export function CoverManager({ collectionId, today }: { collectionId: string; today: string }) {
  const covers = useCovers(collectionId);
  const change = useCoverChanges(collectionId);
  const [draft, setDraft] = useState({ email: '', firstDay: today, lastDay: today, message: '' });
  const [sent, setSent] = useState<string | null>(null);
  const issues = (change.create.error as { issues?: { path: string; message: string }[] } | null)?.issues ?? [];
  const fieldError = (f: string) => issues.find((i) => i.path.endsWith(f))?.message;
  return (
    <div className="flex flex-col gap-4">
      <form
        className="flex flex-col gap-3 rounded-2xl border-2 border-border p-3"
        onSubmit={(e) => {
          e.preventDefault();
          setSent(null);
          change.create.mutate(draft, { onSuccess: () => (setSent(draft.email), setDraft((d) => ({ ...d, email: '', message: '' }))) });
        }}
      >
        <h2 className="text-xl font-extrabold">Ask someone to cover</h2>
        <TextField label="Their e-mail" type="email" autoComplete="off" value={draft.email} error={fieldError('email')} onChange={(e) => setDraft((d) => ({ ...d, email: e.target.value }))} />
        <div className="grid grid-cols-2 gap-2">
          <TextField label="First day" type="date" value={draft.firstDay} error={fieldError('firstDay')} onChange={(e) => setDraft((d) => ({ ...d, firstDay: e.target.value }))} />
          <TextField label="Last day" type="date" value={draft.lastDay} error={fieldError('lastDay')} onChange={(e) => setDraft((d) => ({ ...d, lastDay: e.target.value }))} />
        </div>
        <TextField label="Message" hint="Shown in the e-mail and on their round." value={draft.message} onChange={(e) => setDraft((d) => ({ ...d, message: e.target.value }))} />
        {change.create.isError && !issues.length && <Notice tone="error" title={change.create.error.message} />}
        {sent && <Notice tone="ok" title={`Invite sent to ${sent}.`} />}
        <Button type="submit" busy={change.create.isPending}>
          Send the invite
        </Button>
      </form>
      {covers.isPending && <Loading />}
      {covers.isError && <Notice tone="error" title={covers.error.message} />}
      <ul aria-label="Covers" className="flex flex-col gap-2">
        {covers.data?.covers.map((c) => (
          <li key={c.id} className="flex flex-col gap-1 rounded-2xl border-2 border-border bg-surface p-3">
            <p className="font-extrabold">
              {c.helperName ?? c.email} · {STATE_WORDS[c.state]}
              {c.inviteExpired && ' (link expired)'}
            </p>
            <p className="text-sm text-muted">
              {c.firstDay} to {c.lastDay}
              {c.safetyAcknowledgedAt ? ' · safety page read' : ''}
            </p>
            {c.state !== 'ended' && (
              <Button variant="danger" onClick={() => change.end.mutate(c.id)} busy={change.end.isPending && change.end.variables === c.id}>
                End this cover now
              </Button>
            )}
          </li>
        ))}
      </ul>
    </div>
  );
}
