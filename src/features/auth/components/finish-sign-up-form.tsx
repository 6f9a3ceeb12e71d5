import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { accountDetails } from '#shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { useServerProblem } from '@/lib/form-errors';
import { useFinishSignUp } from '../api/finish-sign-up';
import { useSignUpPreview } from '../api/preview-sign-up';
import { AccountFields, deviceZone } from './account-fields';

type Input = z.input<typeof accountDetails>;
type Output = z.output<typeof accountDetails>;

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
      <AccountFields register={register} errors={e} />
      <Button type="submit" wide busy={formState.isSubmitting}>
        Create account
      </Button>
    </form>
  );
}
