import { useRegisterSW } from 'virtual:pwa-register/react';
import { Button } from '@/components/ui/button';
import { useSyncStatus } from '@/lib/sync-driver';

/**
 * The service worker waits with a new version until the keeper agrees, and it is only applied
 * with an empty outbox: an update never reloads the page over taps still on their way.
 */
export function UpdateBanner() {
  const {
    needRefresh: [needRefresh, setNeedRefresh],
    updateServiceWorker,
  } = useRegisterSW({ immediate: true });
  const { waiting } = useSyncStatus();
  if (!needRefresh) return null;
  return (
    <div
      role="status"
      className="fixed inset-x-2 bottom-24 z-30 flex items-center gap-3 rounded-2xl border-2 border-accent bg-surface p-3 shadow-lg"
    >
      <p className="flex-1 font-bold">
        A new version of Rackside is ready.
        {waiting > 0 && (
          <span className="block font-normal">
            It installs once your {waiting} waiting taps are saved.
          </span>
        )}
      </p>
      <Button variant="quiet" onClick={() => setNeedRefresh(false)}>
        Later
      </Button>
      <Button disabled={waiting > 0} onClick={() => void updateServiceWorker(true)}>
        Update
      </Button>
    </div>
  );
}
