import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import type { z } from 'zod';
import { capitalised, formatDateRange } from '#shared/domain/date-words';
import { PASSWORD_MIN_CHARS, type MeResponse } from '#shared/schemas/auth';
import { acceptBody } from '#shared/schemas/cover';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { PasswordField } from '@/components/ui/password-field';
import { Loading } from '@/components/ui/spinner';
import { TextField } from '@/components/ui/text-field';
import { ApiError } from '@/lib/api-client';
import { useServerProblem } from '@/lib/form-errors';
import { acceptInvite, useInvitePreview } from '../api/cover-api';

interface Props {
  token: string;
  /** The signed-in person, if any. */
  me: MeResponse | null;
  onAccepted: (me: MeResponse, collectionId: string) => void;
}

/** The account a newcomer makes with the invite, named by the body's paths. */
const accountForm = acceptBody.pick({ account: true }).required();
type Input = z.input<typeof accountForm>;
type Output = z.output<typeof accountForm>;

/** The invite link's page: who asks, for what (a cover's days, or keeping), and one step to accept. */
export function AcceptInvite({ token, me, onAccepted }: Props) {
  const preview = useInvitePreview(token);
  const { register, handleSubmit, setError, formState } = useForm<Input, unknown, Output>({
    resolver: zodResolver(accountForm),
    defaultValues: { account: { displayName: '', password: '' } },
  });
  const { problem, attempt } = useServerProblem(setError);
  const [tap, setTap] = useState<{ busy: boolean; error: string | null }>({
    busy: false,
    error: null,
  });
  if (preview.isPending) return <Loading />;
  if (preview.isError) return <Notice tone="error" title={preview.error.message} />;
  const p = preview.data;
  const signedInAsInvited = me?.user.email === p.email;
  const accept = async (account?: Output['account']) => {
    const result = await acceptInvite({ token, account });
    onAccepted(result.me, result.collectionId);
  };
  // Signed in already: one tap, no fields, so the server's words are all there is to show.
  const acceptSignedIn = async () => {
    setTap({ busy: true, error: null });
    try {
      await accept();
    } catch (err) {
      const issues = err instanceof ApiError ? err.issues?.map((i) => i.message).join(' ') : null;
      setTap({ busy: false, error: issues || (err as Error).message });
    }
  };
  const submit = handleSubmit(({ account }) => attempt(() => accept(account)));
  const error = tap.error ?? problem;
  // A keeper's or co-owner's invite: no days, the /join link.
  const keeper = p.role !== 'helper';
  const action = keeper ? 'Accept the invite' : 'Accept the cover';
  return (
    <div className="flex flex-col gap-4">
      {p.role === 'owner' ? (
        <>
          <h2 className="text-2xl font-extrabold">Own {p.collectionName} together</h2>
          <p>
            {p.invitedBy ?? 'Its owner'} invites {p.email} to own this collection with them: its
            rounds, its animals’ records and labels, and also who keeps it, its covers and its
            backups.
          </p>
        </>
      ) : keeper ? (
        <>
          <h2 className="text-2xl font-extrabold">Keep {p.collectionName}</h2>
          <p>
            {p.invitedBy ?? 'Its owner'} invites {p.email} to keep this collection with them: its
            rounds, its animals’ records and their labels.
          </p>
        </>
      ) : (
        <>
          <h2 className="text-2xl font-extrabold">Cover the feeds at {p.collectionName}</h2>
          <p>
            {p.firstDay && p.lastDay ? (
              <span className="font-bold">
                {capitalised(formatDateRange(p.firstDay, p.lastDay))}
              </span>
            ) : (
              'On the days the owner set'
            )}
            , for {p.email}.
          </p>
        </>
      )}
      {p.message && (
        <p className="whitespace-pre-line rounded-xl border-2 border-border p-2">{p.message}</p>
      )}
      {error && <Notice tone="error" title={error} />}
      {p.hasAccount ? (
        signedInAsInvited ? (
          <Button busy={tap.busy} onClick={() => void acceptSignedIn()}>
            {action}
          </Button>
        ) : (
          <>
            <p>
              You already have a Rackside account with this e-mail. Sign in as {p.email}, then come
              back to this link.
            </p>
            <Link
              to="/sign-in"
              state={{ from: `${keeper ? '/join' : '/cover/accept'}?token=${token}` }}
              className="inline-flex min-h-target items-center justify-center rounded-xl border-2 border-primary bg-primary px-4 text-lg font-bold text-on-primary"
            >
              Sign in
            </Link>
          </>
        )
      ) : (
        <form className="flex flex-col gap-3" onSubmit={submit}>
          <p>
            {keeper
              ? 'Make your account to join this collection.'
              : 'Make your account: it works only for these days in this collection.'}
          </p>
          <TextField
            label="Your name"
            autoComplete="name"
            error={formState.errors.account?.displayName?.message}
            {...register('account.displayName')}
          />
          <PasswordField
            label="Password"
            autoComplete="new-password"
            hint={`At least ${PASSWORD_MIN_CHARS} characters. A few words you will remember work well.`}
            error={formState.errors.account?.password?.message}
            {...register('account.password')}
          />
          <Button type="submit" busy={formState.isSubmitting}>
            {action}
          </Button>
        </form>
      )}
    </div>
  );
}
