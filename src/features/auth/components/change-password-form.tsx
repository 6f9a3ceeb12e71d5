import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { changePasswordBody } from '#shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { PasswordField } from '@/components/ui/password-field';
import { useServerProblem } from '@/lib/form-errors';
import { useChangePassword } from '../api/change-password';

type Values = z.infer<typeof changePasswordBody>;

export function ChangePasswordForm() {
  const change = useChangePassword();
  const { register, handleSubmit, setError, formState, reset } = useForm<Values>({
    resolver: zodResolver(changePasswordBody),
  });
  const { problem, attempt } = useServerProblem(setError);

  const submit = handleSubmit((values) =>
    attempt(async () => {
      await change.mutateAsync(values);
      reset();
    }),
  );

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      {problem && <Notice tone="error" title={problem} />}
      {change.isSuccess && (
        <Notice tone="ok" title="Password changed. Other devices were signed out." />
      )}
      <PasswordField
        label="Current password"
        autoComplete="current-password"
        error={formState.errors.currentPassword?.message}
        {...register('currentPassword')}
      />
      <PasswordField
        label="New password"
        autoComplete="new-password"
        error={formState.errors.newPassword?.message}
        {...register('newPassword')}
      />
      <Button type="submit" variant="secondary" busy={formState.isSubmitting}>
        Change password
      </Button>
    </form>
  );
}
