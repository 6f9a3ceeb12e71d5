import { Link } from 'react-router-dom';
import { PublicPage } from '@/components/ui/public-page';
import { SignUpForm } from '@/features/auth/components/sign-up-form';

export function SignUpRoute() {
  return (
    <PublicPage title="Create your account">
      <p className="text-muted">
        You will own a new collection. Later, invite a partner or a keeper from Settings → People,
        and a helper from Settings → Cover for a helper.
      </p>
      <SignUpForm />
      <Link
        className="inline-flex min-h-target items-center font-bold underline underline-offset-4"
        to="/sign-in"
      >
        I already have an account
      </Link>
    </PublicPage>
  );
}
