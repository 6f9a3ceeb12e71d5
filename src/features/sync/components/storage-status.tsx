import { useQuery } from '@tanstack/react-query';
import { queryKeys } from '@/lib/query-keys';
import { storageState } from '@/lib/storage';

const WORDS = {
  kept: 'Kept: the browser has agreed not to clear Rackside’s offline data.',
  may_be_cleared:
    'Not guaranteed: the browser may clear Rackside’s offline data when space runs low. Installing Rackside to the home screen usually changes that.',
  unsupported: 'This browser cannot promise to keep offline data.',
} as const;

/** Whether the browser granted persistent storage (asked after the first real tap). */
export function StorageStatus() {
  const state = useQuery({
    queryKey: queryKeys.storage.persisted(),
    queryFn: storageState,
    networkMode: 'always',
  });
  return (
    <section aria-labelledby="storage-heading" className="flex flex-col gap-1">
      <h2 id="storage-heading" className="text-xl font-extrabold">
        Offline storage
      </h2>
      <p>{state.data ? WORDS[state.data] : 'Checking…'}</p>
    </section>
  );
}
