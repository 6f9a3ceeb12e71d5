import { Link } from 'react-router-dom';
import { PublicPage } from '@/components/ui/public-page';

export function NotFoundRoute() {
  return (
    <PublicPage title="Nothing here">
      <p>This page does not exist.</p>
      <Link
        className="inline-flex min-h-target items-center font-bold underline underline-offset-4"
        to="/today"
      >
        Go to today&apos;s round
      </Link>
    </PublicPage>
  );
}
