import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';

/** Shown when a round is neither on the phone nor reachable. */
export function RoundUnavailable({ error, what }: { error: Error | null; what: string }) {
  const offline = error instanceof ApiError && error.status === 0;
  const title = offline
    ? `No signal, and ${what} is not on this phone yet. Open Rackside once with signal before going to the racks.`
    : (error?.message ?? `${what} could not be loaded.`);
  return <Notice tone="error" title={title} />;
}
