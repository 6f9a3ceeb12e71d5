import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { Notice } from '@/components/ui/notice';
import { PublicPage } from '@/components/ui/public-page';
import { ResetPasswordForm } from '@/features/auth/components/reset-password-form';

export function ResetPasswordRoute() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const [done, setDone] = useState(false);
  return (
    <PublicPage title="Choose a new password">
      {done ? (
        <Notice tone="ok" title="Your password is changed. Sign in with it now." />
      ) : token ? (
        <ResetPasswordForm token={token} onDone={() => setDone(true)} />
      ) : (
        <Notice tone="error" title="This page needs the link from the reset e-mail." />
      )}
      <Link
        className="inline-flex min-h-target items-center font-bold underline underline-offset-4"
        to="/sign-in"
      >
        Go to sign in
      </Link>
    </PublicPage>
  );
}
