import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { describeInstant } from '#shared/domain/local-dates';
import type { Role } from '#shared/domain/roles';
import {
  addMemberBody,
  MEMBER_INVITE_ROLES,
  type MemberInviteRole,
  type PendingInvite,
} from '#shared/schemas/collections';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useInviteMember } from '../api/invite-member';
import { useMembers } from '../api/list-members';
import { usePendingInviteChanges } from '../api/pending-invites';
import { useRemoveMember } from '../api/remove-member';

/** The invite's e-mail; the role is the chips above the field. */
const inviteForm = addMemberBody.pick({ email: true });
type Input = z.input<typeof inviteForm>;
type Output = z.output<typeof inviteForm>;

const ROLE_WORDS: Record<Role, string> = {
  owner: 'Owner',
  keeper: 'Keeper',
  helper: 'Helper (cover)',
};
const INVITE_ROLE_WORDS: Record<MemberInviteRole, { chip: string; what: string }> = {
  keeper: {
    chip: 'Keeper',
    what: 'Does the rounds, keeps the records and prints labels. Cannot invite people, arrange covers or delete the collection.',
  },
  owner: {
    chip: 'Co-owner (partner)',
    what: 'Everything you can do: also invites people, arranges covers, backs up and deletes the collection.',
  },
};

/**
 * The owner's people: who keeps the collection, invites by e-mail to a keeper or a partner as
 * co-owner (they join only by accepting), and the invites still waiting for an answer.
 */
export function MembersPanel({
  collectionId,
  ownUserId,
  timeZone,
}: {
  collectionId: string;
  ownUserId: string;
  timeZone: string;
}) {
  const list = useMembers(collectionId);
  const invite = useInviteMember(collectionId);
  const remove = useRemoveMember(collectionId);
  const [removing, setRemoving] = useState<string | null>(null);
  const [role, setRole] = useState<MemberInviteRole>('keeper');
  const { register, handleSubmit, setError, formState, reset } = useForm<Input, unknown, Output>({
    resolver: zodResolver(inviteForm),
  });
  const { problem, attempt } = useServerProblem(setError);
  const submit = handleSubmit((values) =>
    attempt(async () => {
      await invite.mutateAsync({ email: values.email, role });
      reset();
    }),
  );
  return (
    <div className="flex flex-col gap-6">
      <section aria-labelledby="members-heading" className="flex flex-col gap-3">
        <h2 id="members-heading" className="text-xl font-extrabold">
          Who keeps this collection
        </h2>
        {list.isPending ? (
          <Loading />
        ) : list.isError ? (
          <Notice tone="error" title={list.error.message} />
        ) : (
          <ul aria-label="Members" className="flex flex-col gap-2">
            {list.data.members.map((m) => (
              <li
                key={m.userId}
                className="flex flex-col gap-2 rounded-xl border-2 border-border bg-surface p-3"
              >
                <p>
                  <span className="font-bold">{m.displayName}</span>
                  {m.userId === ownUserId && ' (you)'} · {ROLE_WORDS[m.role]}
                  <span className="block break-all text-sm text-muted">{m.email}</span>
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
                    <Button
                      variant="secondary"
                      className="sm:self-start"
                      onClick={() => setRemoving(m.userId)}
                    >
                      Remove…
                    </Button>
                  ))}
              </li>
            ))}
          </ul>
        )}
        {remove.isError && <Notice tone="error" title={remove.error.message} />}
      </section>

      <form
        onSubmit={submit}
        noValidate
        aria-labelledby="invite-heading"
        className="flex flex-col gap-3 rounded-2xl border-2 border-border p-3"
      >
        <h2 id="invite-heading" className="text-xl font-extrabold">
          Invite someone by e-mail
        </h2>
        <ChoiceGroup
          legend="As"
          className="grid-cols-2"
          value={role}
          options={MEMBER_INVITE_ROLES}
          onChange={setRole}
          render={(r) => INVITE_ROLE_WORDS[r].chip}
        />
        <p className="text-sm text-muted">{INVITE_ROLE_WORDS[role].what}</p>
        <TextField
          label="Their e-mail"
          hint="They get a link that works once, for a week. Nothing changes unless they accept it."
          type="email"
          autoComplete="off"
          inputMode="email"
          error={formState.errors.email?.message}
          {...register('email')}
        />
        {problem && <Notice tone="error" title={problem} />}
        {invite.data && !formState.isDirty && <Notice tone="ok" title={invite.data.message} />}
        <Button type="submit" busy={formState.isSubmitting}>
          Send the invite
        </Button>
      </form>

      {list.data && (
        <PendingInvites
          collectionId={collectionId}
          invites={list.data.invites}
          timeZone={timeZone}
        />
      )}
    </div>
  );
}

function PendingInvites({
  collectionId,
  invites,
  timeZone,
}: {
  collectionId: string;
  invites: PendingInvite[];
  timeZone: string;
}) {
  const change = usePendingInviteChanges(collectionId);
  const [cancelling, setCancelling] = useState<string | null>(null);
  const when = (iso: string) => describeInstant(iso, timeZone);
  return (
    <section aria-labelledby="pending-heading" className="flex flex-col gap-2">
      <h2 id="pending-heading" className="text-xl font-extrabold">
        Waiting for an answer
      </h2>
      {!invites.length && <p className="text-muted">No invites are waiting.</p>}
      {change.resend.data && <Notice tone="ok" title={change.resend.data.message} />}
      {change.resend.isError && <Notice tone="error" title={change.resend.error.message} />}
      {change.revoke.isError && <Notice tone="error" title={change.revoke.error.message} />}
      <ul aria-label="Invites waiting for an answer" className="flex flex-col gap-2">
        {invites.map((i) => (
          <li
            key={i.id}
            className="flex flex-col gap-2 rounded-xl border-2 border-dashed border-border p-3"
          >
            <p>
              <span className="break-all font-bold">{i.email}</span> ·{' '}
              {INVITE_ROLE_WORDS[i.role].chip}
              <span className="block text-sm text-muted">
                Sent {when(i.sentAt)} ·{' '}
                {i.expired ? (
                  <span className="font-bold text-danger">link expired {when(i.expiresAt)}</span>
                ) : (
                  <>link works until {when(i.expiresAt)}</>
                )}
              </span>
            </p>
            {cancelling === i.id ? (
              <div className="flex flex-col gap-2">
                <p className="font-bold">
                  Cancel the invite to {i.email}? Their link will stop working.
                </p>
                <div className="flex flex-wrap gap-2">
                  <Button
                    variant="danger"
                    busy={change.revoke.isPending}
                    onClick={() =>
                      change.revoke.mutate(i.id, { onSuccess: () => setCancelling(null) })
                    }
                  >
                    Cancel the invite
                  </Button>
                  <Button variant="secondary" onClick={() => setCancelling(null)}>
                    Keep it
                  </Button>
                </div>
              </div>
            ) : (
              <div className="flex flex-wrap gap-2">
                <Button
                  variant="secondary"
                  busy={change.resend.isPending && change.resend.variables === i.id}
                  onClick={() => change.resend.mutate(i.id)}
                  aria-label={`Send the invite to ${i.email} again`}
                >
                  Send again
                </Button>
                <Button
                  variant="secondary"
                  onClick={() => setCancelling(i.id)}
                  aria-label={`Cancel the invite to ${i.email}…`}
                >
                  Cancel…
                </Button>
              </div>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}
