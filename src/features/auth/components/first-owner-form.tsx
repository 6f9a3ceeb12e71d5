import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { firstOwnerBody, PASSWORD_MIN_CHARS } from '#shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { PasswordField } from '@/components/ui/password-field';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useCreateFirstOwner } from '../api/first-owner';

type Input = z.input<typeof firstOwnerBody>;
type Output = z.output<typeof firstOwnerBody>;

const deviceZone = Intl.DateTimeFormat().resolvedOptions().timeZone;

/** A server with no account yet: the first visitor makes theirs, and owns the first collection. */
export function FirstOwnerForm({ onCreated }: { onCreated: () => void }) {
  const create = useCreateFirstOwner();
  const { register, handleSubmit, setError, formState } = useForm<Input, unknown, Output>({
    resolver: zodResolver(firstOwnerBody),
    defaultValues: { timeZone: deviceZone },
  });
  const { problem, attempt } = useServerProblem(setError);
  const e = formState.errors;

  const submit = handleSubmit((values) =>
    attempt(async () => {
      await create.mutateAsync(values);
      onCreated();
    }),
  );

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      <p>
        This server has no account yet. Make yours: you will own the first collection, and can
        invite other keepers and helpers to it later.
      </p>
      {problem && <Notice tone="error" title={problem} />}
      <TextField
        label="E-mail"
        type="email"
        autoComplete="username"
        inputMode="email"
        hint="You sign in with it. Reset links go there once the server can send e-mail."
        error={e.email?.message}
        {...register('email')}
      />
      <TextField
        label="Your name"
        autoComplete="name"
        error={e.displayName?.message}
        {...register('displayName')}
      />
      <PasswordField
        label="Password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_CHARS} characters. A few words you will remember work well.`}
        error={e.password?.message}
        {...register('password')}
      />
      <TextField
        label="Collection name"
        hint="For example: Spare room racks"
        error={e.collectionName?.message}
        {...register('collectionName')}
      />
      <TextField
        label="Time zone"
        hint="Your rounds follow the calendar days of this zone."
        autoComplete="off"
        error={e.timeZone?.message}
        {...register('timeZone')}
      />
      <Button type="submit" wide busy={formState.isSubmitting}>
        Create the first account
      </Button>
    </form>
  );
}
