import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { firstOwnerBody } from '#shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useCreateFirstOwner } from '../api/first-owner';
import { AccountFields, deviceZone } from './account-fields';

type Input = z.input<typeof firstOwnerBody>;
type Output = z.output<typeof firstOwnerBody>;

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
      <AccountFields register={register} errors={e} />
      <Button type="submit" wide busy={formState.isSubmitting}>
        Create the first account
      </Button>
    </form>
  );
}
