import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { PASSWORD_MIN_CHARS, signUpBody } from '#shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { PasswordField } from '@/components/ui/password-field';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useSignUp } from '../api/sign-up';

type Input = z.input<typeof signUpBody>;
type Output = z.output<typeof signUpBody>;

const deviceZone = Intl.DateTimeFormat().resolvedOptions().timeZone;

export function SignUpForm({ onSignedUp }: { onSignedUp: () => void }) {
  const signUp = useSignUp();
  const { register, handleSubmit, setError, formState } = useForm<Input, unknown, Output>({
    resolver: zodResolver(signUpBody),
    defaultValues: { timeZone: deviceZone },
  });
  const { problem, attempt } = useServerProblem(setError);
  const e = formState.errors;

  const submit = handleSubmit((values) =>
    attempt(async () => {
      await signUp.mutateAsync(values);
      onSignedUp();
    }),
  );

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      {problem && <Notice tone="error" title={problem} />}
      <TextField
        label="Your name"
        autoComplete="name"
        error={e.displayName?.message}
        {...register('displayName')}
      />
      <TextField
        label="E-mail"
        type="email"
        autoComplete="email"
        inputMode="email"
        error={e.email?.message}
        {...register('email')}
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
