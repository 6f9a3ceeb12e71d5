import { Link, useLocation, useNavigate } from 'react-router-dom';
import { PublicPage } from '@/components/ui/public-page';
import { SafetyNote } from '@/components/ui/safety-note';
import { useFirstRun } from '@/features/auth/api/first-owner';
import { FirstOwnerForm } from '@/features/auth/components/first-owner-form';
import { SignInForm } from '@/features/auth/components/sign-in-form';

export function SignInRoute() {
  const navigate = useNavigate();
  const from = (useLocation().state as { from?: string } | null)?.from ?? '/today';
  // An empty server (started without the demo): its first visitor makes the first account.
  // Offline or on an older server the question fails quietly and the sign-in form shows.
  const firstRun = useFirstRun();
  if (firstRun.data?.firstOwner)
    return (
      <PublicPage title="Welcome to Rackside">
        <FirstOwnerForm onCreated={() => navigate('/today', { replace: true })} />
        <SafetyNote />
      </PublicPage>
    );
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
