import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { accountDetails, PASSWORD_MIN_CHARS } from '#shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { PasswordField } from '@/components/ui/password-field';
import { Loading } from '@/components/ui/spinner';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useFinishSignUp } from '../api/finish-sign-up';
import { useSignUpPreview } from '../api/preview-sign-up';

type Input = z.input<typeof accountDetails>;
type Output = z.output<typeof accountDetails>;

const deviceZone = Intl.DateTimeFormat().resolvedOptions().timeZone;

/** The sign-up link's page: the account for the address the link was sent to. */
export function FinishSignUpForm({ token, onSignedUp }: { token: string; onSignedUp: () => void }) {
  const preview = useSignUpPreview(token);
  const finish = useFinishSignUp();
  const { register, handleSubmit, setError, formState } = useForm<Input, unknown, Output>({
    resolver: zodResolver(accountDetails),
    defaultValues: { timeZone: deviceZone },
  });
  const { problem, attempt } = useServerProblem(setError);
  const e = formState.errors;

  const submit = handleSubmit((values) =>
    attempt(async () => {
      await finish.mutateAsync({ ...values, token });
      onSignedUp();
    }),
  );

  if (preview.isPending) return <Loading />;
  if (preview.isError) return <Notice tone="error" title={preview.error.message} />;
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      <p>
        Your account for <span className="font-bold">{preview.data.email}</span>.
      </p>
      {problem && <Notice tone="error" title={problem} />}
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
        Create account
      </Button>
    </form>
  );
}
