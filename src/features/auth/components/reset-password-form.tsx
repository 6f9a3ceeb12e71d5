import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { newPassword } from '#shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { PasswordField } from '@/components/ui/password-field';
import { useServerProblem } from '@/lib/form-errors';
import { useResetPassword } from '../api/reset-password';

const form = z
  .object({ password: newPassword, repeat: z.string() })
  .refine((v) => v.password === v.repeat, {
    message: 'The two passwords are not the same.',
    path: ['repeat'],
  });
type Values = z.infer<typeof form>;

export function ResetPasswordForm({ token, onDone }: { token: string; onDone: () => void }) {
  const reset = useResetPassword();
  const { register, handleSubmit, setError, formState } = useForm<Values>({
    resolver: zodResolver(form),
  });
  const { problem, attempt } = useServerProblem(setError);

  const submit = handleSubmit(({ password }) =>
    attempt(async () => {
      await reset.mutateAsync({ token, password });
      onDone();
    }),
  );

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      {problem && <Notice tone="error" title={problem} />}
      <PasswordField
        label="New password"
        autoComplete="new-password"
        error={formState.errors.password?.message}
        {...register('password')}
      />
      <PasswordField
        label="New password again"
        autoComplete="new-password"
        error={formState.errors.repeat?.message}
        {...register('repeat')}
      />
      <Button type="submit" wide busy={formState.isSubmitting}>
        Save new password
      </Button>
    </form>
  );
}
