import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { Notice } from '@/components/ui/notice';
import { PublicPage } from '@/components/ui/public-page';
import { FinishSignUpForm } from '@/features/auth/components/finish-sign-up-form';

/** /sign-up/finish?token=…: reached from the sign-up e-mail. */
export function SignUpFinishRoute() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const token = params.get('token') ?? '';
  return (
    <PublicPage title="Create your account">
      {token ? (
        <FinishSignUpForm token={token} onSignedUp={() => navigate('/today', { replace: true })} />
      ) : (
        <Notice tone="error" title="This page needs the link from the sign-up e-mail." />
      )}
      <Link
        className="inline-flex min-h-target items-center font-bold underline underline-offset-4"
        to="/sign-up"
      >
        Start again
      </Link>
    </PublicPage>
  );
}
