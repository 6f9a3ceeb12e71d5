import { useState } from 'react';
import { Link } from 'react-router-dom';
import { PASSWORD_MIN_CHARS, type MeResponse } from '#shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { PasswordField } from '@/components/ui/password-field';
import { Loading } from '@/components/ui/spinner';
import { TextField } from '@/components/ui/text-field';
import { ApiError } from '@/lib/api-client';
import { acceptInvite, useInvitePreview } from '../api/cover-api';

interface Props {
  token: string;
  /** The signed-in person, if any. */
  me: MeResponse | null;
  onAccepted: (me: MeResponse, collectionId: string) => void;
}

/** The invite link's page: who asks, for what (a cover's days, or keeping), and one step to accept. */
export function AcceptInvite({ token, me, onAccepted }: Props) {
  const preview = useInvitePreview(token);
  const [account, setAccount] = useState({ displayName: '', password: '' });
  const [state, setState] = useState<{ busy: boolean; error: string | null }>({ busy: false, error: null });
  if (preview.isPending) return <Loading />;
  if (preview.isError) return <Notice tone="error" title={preview.error.message} />;
  const p = preview.data;
  const signedInAsInvited = me?.user.email === p.email;
  const accept = async (withAccount: boolean) => {
    setState({ busy: true, error: null });
    try {
      const result = await acceptInvite({ token, account: withAccount ? account : undefined });
      onAccepted(result.me, result.collectionId);
    } catch (err) {
      const issues = err instanceof ApiError ? err.issues?.map((i) => i.message).join(' ') : null;
      setState({ busy: false, error: issues || (err as Error).message });
    }
  };
  const keeper = p.role === 'keeper';
  const action = keeper ? 'Accept the invite' : 'Accept the cover';
  return (
    <div className="flex flex-col gap-4">
      {keeper ? (
        <>
          <h2 className="text-2xl font-extrabold">Keep {p.collectionName}</h2>
          <p>
            {p.invitedBy ?? 'Its owner'} invites {p.email} to keep this collection with them: its rounds, its animals’ records and their labels.
          </p>
        </>
      ) : (
        <>
          <h2 className="text-2xl font-extrabold">Cover the feeds at {p.collectionName}</h2>
          <p>
            From <span className="font-bold">{p.firstDay}</span> to <span className="font-bold">{p.lastDay}</span>, for {p.email}.
          </p>
        </>
      )}
      {p.message && <p className="whitespace-pre-line rounded-xl border-2 border-border p-2">{p.message}</p>}
      {state.error && <Notice tone="error" title={state.error} />}
      {p.hasAccount ? (
        signedInAsInvited ? (
          <Button busy={state.busy} onClick={() => void accept(false)}>
            {action}
          </Button>
        ) : (
          <>
            <p>You already have a Rackside account with this e-mail. Sign in as {p.email}, then come back to this link.</p>
            <Link to="/sign-in" state={{ from: `${keeper ? '/join' : '/cover/accept'}?token=${token}` }} className="inline-flex min-h-target items-center justify-center rounded-xl border-2 border-primary bg-primary px-4 text-lg font-bold text-on-primary">
              Sign in
            </Link>
          </>
        )
      ) : (
        <form
          className="flex flex-col gap-3"
          onSubmit={(e) => {
            e.preventDefault();
            void accept(true);
          }}
        >
          <p>{keeper ? 'Make your account to join this collection.' : 'Make your account: it works only for these days in this collection.'}</p>
          <TextField label="Your name" autoComplete="name" value={account.displayName} onChange={(e) => setAccount((a) => ({ ...a, displayName: e.target.value }))} />
          <PasswordField label="Password" autoComplete="new-password" hint={`At least ${PASSWORD_MIN_CHARS} characters. A few words you will remember work well.`} value={account.password} onChange={(e) => setAccount((a) => ({ ...a, password: e.target.value }))} />
          <Button type="submit" busy={state.busy}>
            {action}
          </Button>
        </form>
      )}
    </div>
  );
}
