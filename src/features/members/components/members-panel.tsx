import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { addMemberBody } from '#shared/schemas/collections';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useInviteMember } from '../api/invite-member';
import { useMembers } from '../api/list-members';
import { useRemoveMember } from '../api/remove-member';

/** The invite's e-mail; the role is always keeper here. */
const inviteForm = addMemberBody.pick({ email: true });
type Input = z.input<typeof inviteForm>;
type Output = z.output<typeof inviteForm>;

/** The owner's list of who keeps the collection, with invites by e-mail (accepted, never imposed). */
export function MembersPanel({
  collectionId,
  ownUserId,
}: {
  collectionId: string;
  ownUserId: string;
}) {
  const list = useMembers(collectionId);
  const invite = useInviteMember(collectionId);
  const remove = useRemoveMember(collectionId);
  const [removing, setRemoving] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState, reset } = useForm<Input, unknown, Output>({
    resolver: zodResolver(inviteForm),
  });
  const { problem, attempt } = useServerProblem(setError);
  const submit = handleSubmit((values) =>
    attempt(async () => {
      await invite.mutateAsync(values.email);
      reset();
    }),
  );
  return (
    <section aria-labelledby="members-heading" className="flex flex-col gap-3">
      <h2 id="members-heading" className="text-xl font-extrabold">
        Who keeps this collection
      </h2>
      {list.isPending ? (
        <Loading />
      ) : list.isError ? (
        <Notice tone="error" title={list.error.message} />
      ) : (
        <ul className="flex flex-col gap-2">
          {list.data.members.map((m) => (
            <li
              key={m.userId}
              className="flex flex-col gap-2 rounded-xl border-2 border-border bg-surface p-2"
            >
              <p>
                <span className="font-bold">{m.displayName}</span> · {m.role} ·{' '}
                <span className="break-all">{m.email}</span>
              </p>
              {m.userId !== ownUserId &&
                (removing === m.userId ? (
                  <div className="flex flex-wrap gap-2">
                    <Button
                      variant="danger"
                      busy={remove.isPending}
                      onClick={() =>
                        remove.mutate(m.userId, { onSuccess: () => setRemoving(null) })
                      }
                    >
                      Remove {m.displayName}
                    </Button>
                    <Button variant="secondary" onClick={() => setRemoving(null)}>
                      Keep
                    </Button>
                  </div>
                ) : (
                  <Button variant="secondary" onClick={() => setRemoving(m.userId)}>
                    Remove…
                  </Button>
                ))}
            </li>
          ))}
          {list.data.invites.map((i) => (
            <li key={i.id} className="rounded-xl border-2 border-dashed border-border p-2">
              <span className="break-all">{i.email}</span> · invited, not answered yet
            </li>
          ))}
        </ul>
      )}
      {remove.isError && <Notice tone="error" title={remove.error.message} />}
      <form onSubmit={submit} noValidate className="flex flex-col gap-2">
        {problem && <Notice tone="error" title={problem} />}
        {invite.data && <Notice tone="ok" title={invite.data.message} />}
        <TextField
          label="Invite a keeper by e-mail"
          hint="They get a link and join only if they accept it."
          type="email"
          autoComplete="off"
          inputMode="email"
          error={formState.errors.email?.message}
          {...register('email')}
        />
        <Button type="submit" variant="secondary" busy={formState.isSubmitting}>
          Send the invite
        </Button>
      </form>
    </section>
  );
}
