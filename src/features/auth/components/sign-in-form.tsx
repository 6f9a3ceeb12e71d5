import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { signInBody } from '#shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { PasswordField } from '@/components/ui/password-field';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useDemoInfo } from '../api/get-demo-info';
import { useSignIn } from '../api/sign-in';

type Input = z.input<typeof signInBody>;
type Output = z.output<typeof signInBody>;

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const signIn = useSignIn();
  const demo = useDemoInfo();
  const { register, handleSubmit, setError, setValue, formState } = useForm<Input, unknown, Output>(
    {
      resolver: zodResolver(signInBody),
    },
  );
  const { problem, attempt } = useServerProblem(setError);

  const submit = handleSubmit((values) =>
    attempt(async () => {
      await signIn.mutateAsync(values);
      onSignedIn();
    }),
  );

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      {problem && <Notice tone="error" title={problem} />}
      <TextField
        label="E-mail"
        type="email"
        autoComplete="username"
        inputMode="email"
        error={formState.errors.email?.message}
        {...register('email')}
      />
      <PasswordField
        label="Password"
        autoComplete="current-password"
        error={formState.errors.password?.message}
        {...register('password')}
      />
      <Button type="submit" wide busy={formState.isSubmitting}>
        Sign in
      </Button>
      {demo.data?.demo && (
        <section
          aria-labelledby="demo-heading"
          className="rounded-xl border-2 border-dashed border-border p-3"
        >
          <h2 id="demo-heading" className="font-bold">
            Demo accounts
          </h2>
          <p className="text-sm text-muted">
            This server runs in demo mode. Every demo account uses the password{' '}
            <code className="font-bold text-text">{demo.data.password}</code>.
          </p>
          <ul className="mt-2 flex flex-col gap-2">
            {demo.data.accounts.map((a) => (
              <li key={a.email}>
                <Button
                  variant="secondary"
                  wide
                  className="!justify-start text-left !text-base"
                  onClick={() => {
                    setValue('email', a.email);
                    setValue('password', demo.data.password ?? '');
                  }}
                >
                  Use {a.email} ({a.role})
                </Button>
              </li>
            ))}
          </ul>
        </section>
      )}
    </form>
  );
}
