import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { signUpBody } from '#shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useStartSignUp } from '../api/sign-up';

type Input = z.input<typeof signUpBody>;
type Output = z.output<typeof signUpBody>;

/**
 * Sign-up's first step asks only for the e-mail: the link sent there opens the rest, so the
 * address is proven and nobody learns from this page whether it already has an account.
 */
export function SignUpForm() {
  const start = useStartSignUp();
  const { register, handleSubmit, setError, formState } = useForm<Input, unknown, Output>({
    resolver: zodResolver(signUpBody),
  });
  const { problem, attempt } = useServerProblem(setError);
  const submit = handleSubmit((values) => attempt(() => start.mutateAsync(values)));

  if (start.data) {
    return (
      <Notice tone="ok" title={start.data.message}>
        <p>
          Open it on this phone and follow its link. Nothing there after a few minutes? Look in the
          spam folder, or try again.
        </p>
      </Notice>
    );
  }
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      {problem && <Notice tone="error" title={problem} />}
      <TextField
        label="E-mail"
        type="email"
        autoComplete="email"
        inputMode="email"
        error={formState.errors.email?.message}
        {...register('email')}
      />
      <Button type="submit" wide busy={formState.isSubmitting}>
        Send me a sign-up link
      </Button>
    </form>
  );
}
