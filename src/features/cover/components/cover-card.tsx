import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { describeLocalDate } from '#shared/domain/local-dates';
import { coverChangeBody, type CoverSummary } from '#shared/schemas/cover';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useCoverChanges, useCoverReports } from '../api/cover-api';

const STATE_WORDS: Record<CoverSummary['state'], string> = {
  invited: 'Invited',
  upcoming: 'Starts soon',
  running: 'Running now',
  ended: 'Ended',
};

type Input = z.input<typeof coverChangeBody>;
type Output = z.output<typeof coverChangeBody>;

/** "Fri 4 Dec to Thu 10 Dec 2026" */
export const coverDays = (c: Pick<CoverSummary, 'firstDay' | 'lastDay'>) =>
  `${describeLocalDate(c.firstDay, c.firstDay.slice(0, 4) !== c.lastDay.slice(0, 4))} to ${describeLocalDate(c.lastDay, true)}`;

type Mode = 'view' | 'edit' | 'confirm-end';

/**
 * One cover on the owner's page: who and which days; new days, the invite again, or an end
 * (confirmed: it stops the helper at once); once it has ended, its summary.
 */
export function CoverCard({
  collectionId,
  cover: c,
  today,
}: {
  collectionId: string;
  cover: CoverSummary;
  today: string;
}) {
  const change = useCoverChanges(collectionId);
  const [mode, setMode] = useState<Mode>('view');
  const [resent, setResent] = useState(false);
  const who = c.helperName ?? c.email;
  const accepted = !!c.helperName;
  return (
    <li
      aria-label={`${who}, ${STATE_WORDS[c.state]}`}
      className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3"
    >
      <p className="font-extrabold">
        <span className="break-all">{who}</span> · {STATE_WORDS[c.state]}
        {c.inviteExpired && c.state !== 'ended' && (
          <span className="text-danger"> (link expired)</span>
        )}
      </p>
      <p className="text-sm text-muted">
        {coverDays(c)}
        {c.safetyAcknowledgedAt ? ' · safety page read' : ''}
      </p>
      {c.message && <p className="whitespace-pre-line text-sm">{c.message}</p>}
      {resent && <Notice tone="ok" title={`A new invite went to ${c.email}.`} />}
      {change.resend.isError && change.resend.variables === c.id && (
        <Notice tone="error" title={change.resend.error.message} />
      )}
      {change.end.isError && change.end.variables === c.id && (
        <Notice tone="error" title={change.end.error.message} />
      )}

      {c.state !== 'ended' && mode === 'view' && (
        <div className="flex flex-col gap-2 sm:flex-row sm:flex-wrap">
          <Button variant="secondary" onClick={() => setMode('edit')}>
            Change days…
          </Button>
          {!accepted && (
            <Button
              variant="secondary"
              busy={change.resend.isPending && change.resend.variables === c.id}
              onClick={() =>
                change.resend.mutate(c.id, {
                  onSuccess: () => setResent(true),
                })
              }
            >
              Send the invite again
            </Button>
          )}
          <Button variant="danger" onClick={() => setMode('confirm-end')}>
            End this cover now…
          </Button>
        </div>
      )}
      {c.state !== 'ended' && mode === 'edit' && (
        <EditDays
          collectionId={collectionId}
          cover={c}
          today={today}
          onDone={() => setMode('view')}
        />
      )}
      {c.state !== 'ended' && mode === 'confirm-end' && (
        <div
          role="group"
          aria-label="End the cover"
          className="flex flex-col gap-2 rounded-xl border-2 border-danger p-2"
        >
          <p className="font-bold">
            {accepted
              ? `End ${who}’s cover now? They can no longer open the round, and taps still on their phone will not be saved. The summary of the cover comes here and by e-mail.`
              : `Withdraw the cover? The invite to ${c.email} stops working.`}
          </p>
          <div className="flex flex-wrap gap-2">
            <Button
              variant="danger"
              busy={change.end.isPending && change.end.variables === c.id}
              onClick={() => change.end.mutate(c.id, { onSuccess: () => setMode('view') })}
            >
              {accepted ? 'End the cover' : 'Withdraw the cover'}
            </Button>
            <Button variant="secondary" onClick={() => setMode('view')}>
              {accepted ? 'Keep it running' : 'Keep it'}
            </Button>
          </div>
        </div>
      )}
      {c.state === 'ended' && c.hasSummary && (
        <CoverSummaryText collectionId={collectionId} coverId={c.id} />
      )}
    </li>
  );
}

function EditDays({
  collectionId,
  cover: c,
  today,
  onDone,
}: {
  collectionId: string;
  cover: CoverSummary;
  today: string;
  onDone: () => void;
}) {
  const change = useCoverChanges(collectionId);
  const { register, handleSubmit, setError, formState } = useForm<Input, unknown, Output>({
    resolver: zodResolver(coverChangeBody),
    defaultValues: { firstDay: c.firstDay, lastDay: c.lastDay, message: c.message ?? '' },
  });
  const { problem, attempt } = useServerProblem(setError);
  const e = formState.errors;
  const submit = handleSubmit((body) =>
    attempt(async () => {
      await change.change.mutateAsync({ coverId: c.id, body });
      onDone();
    }),
  );
  return (
    <form
      noValidate
      onSubmit={submit}
      aria-label={`New days for ${c.helperName ?? c.email}`}
      className="flex flex-col gap-2"
    >
      <div className="grid grid-cols-1 gap-2 sm:grid-cols-2">
        <TextField
          label="First day"
          type="date"
          min={c.state === 'running' ? undefined : today}
          error={e.firstDay?.message}
          {...register('firstDay')}
        />
        <TextField
          label="Last day"
          type="date"
          min={today}
          error={e.lastDay?.message}
          {...register('lastDay')}
        />
      </div>
      <TextField label="Message" error={e.message?.message} {...register('message')} />
      <p className="text-sm text-muted">
        {c.helperName
          ? `${c.helperName} can open the round on the new days only, from the moment you save.`
          : 'The invite offers the new days; its link works as before.'}
      </p>
      {problem && <Notice tone="error" title={problem} />}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" busy={formState.isSubmitting}>
          Save the days
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

/** The summary made when the cover ended, as e-mailed to the owners. */
function CoverSummaryText({ collectionId, coverId }: { collectionId: string; coverId: string }) {
  const reports = useCoverReports(collectionId);
  const summary = reports.data?.reports.find((r) => r.coverId === coverId);
  if (!summary) return null;
  return (
    <details className="rounded-xl border-2 border-border p-2">
      <summary className="flex min-h-target cursor-pointer items-center font-bold">
        Summary of the cover
      </summary>
      <pre className="whitespace-pre-wrap break-words font-sans text-sm">{summary.body}</pre>
    </details>
  );
}
