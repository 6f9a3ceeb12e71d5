import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { resetRequestBody } from '#shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useRequestReset } from '../api/request-reset';

type Input = z.input<typeof resetRequestBody>;
type Output = z.output<typeof resetRequestBody>;

export function ForgotPasswordForm() {
  const request = useRequestReset();
  const { register, handleSubmit, setError, formState } = useForm<Input, unknown, Output>({
    resolver: zodResolver(resetRequestBody),
  });
  const { problem, attempt } = useServerProblem(setError);

  const submit = handleSubmit(({ email }) =>
    attempt(async () => {
      await request.mutateAsync(email);
    }),
  );

  if (request.data) return <Notice tone="ok" title={request.data.message} />;
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
        Send me a reset link
      </Button>
    </form>
  );
}
