import { Link } from 'react-router-dom';
import { PublicPage } from '@/components/ui/public-page';
import { ForgotPasswordForm } from '@/features/auth/components/forgot-password-form';

export function ForgotPasswordRoute() {
  return (
    <PublicPage title="Reset your password">
      <p className="text-muted">We will e-mail you a link that works for one hour.</p>
      <ForgotPasswordForm />
      <Link
        className="inline-flex min-h-target items-center font-bold underline underline-offset-4"
        to="/sign-in"
      >
        Back to sign in
      </Link>
    </PublicPage>
  );
}
