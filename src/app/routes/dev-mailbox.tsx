import { Link } from 'react-router-dom';
import { PublicPage } from '@/components/ui/public-page';
import { Mailbox } from '@/features/dev-mailbox/components/mailbox';

export function DevMailboxRoute() {
  return (
    <PublicPage title="Dev mailbox">
      <p className="text-muted">
        E-mail this server sent while no mail server is configured. Only in demo and development
        mode.
      </p>
      <Mailbox />
      <Link
        className="inline-flex min-h-target items-center font-bold underline underline-offset-4"
        to="/sign-in"
      >
        Go to sign in
      </Link>
    </PublicPage>
  );
}
