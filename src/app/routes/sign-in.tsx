import { Link, useLocation, useNavigate } from 'react-router-dom';
import { PublicPage } from '@/components/ui/public-page';
import { SafetyNote } from '@/components/ui/safety-note';
import { SignInForm } from '@/features/auth/components/sign-in-form';

export function SignInRoute() {
  const navigate = useNavigate();
  const from = (useLocation().state as { from?: string } | null)?.from ?? '/today';
  return (
    <PublicPage title="Sign in">
      <SignInForm onSignedIn={() => navigate(from, { replace: true })} />
      <p className="flex flex-wrap gap-x-6">
        <Link
          className="inline-flex min-h-target items-center font-bold underline underline-offset-4"
          to="/forgot-password"
        >
          Forgot your password?
        </Link>
        <Link
          className="inline-flex min-h-target items-center font-bold underline underline-offset-4"
          to="/sign-up"
        >
          Create an account
        </Link>
      </p>
      <SafetyNote />
    </PublicPage>
  );
}
