import { Link } from 'react-router-dom';
import { Notice } from '@/components/ui/notice';

/** For someone with no collection (never had one, or all theirs were deleted): a way on. */
export function NoCollection() {
  return (
    <Notice tone="info" title="You are not in any collection yet.">
      <p>Start one of your own, or accept an invite from someone who keeps one.</p>
      <Link
        to="/collections/new"
        className="mt-2 inline-flex min-h-target items-center font-bold underline underline-offset-4"
      >
        Start a collection
      </Link>
    </Notice>
  );
}
