import { useRegisterSW } from 'virtual:pwa-register/react';
import { Button } from '@/components/ui/button';

/**
 * The service worker waits with a new version until the keeper agrees: an update never
 * reloads the page in the middle of a round.
 */
export function UpdateBanner() {
  const {
    needRefresh: [needRefresh, setNeedRefresh],
    updateServiceWorker,
  } = useRegisterSW({ immediate: true });
  if (!needRefresh) return null;
  return (
    <div role="status" className="fixed inset-x-2 bottom-24 z-30 flex items-center gap-3 rounded-2xl border-2 border-accent bg-surface p-3 shadow-lg">
      <p className="flex-1 font-bold">A new version of Rackside is ready.</p>
      <Button variant="quiet" onClick={() => setNeedRefresh(false)}>
        Later
      </Button>
      <Button onClick={() => updateServiceWorker(true)}>Update</Button>
    </div>
  );
}
