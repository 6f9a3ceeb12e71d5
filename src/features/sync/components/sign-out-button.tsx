import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { syncNow, useSyncStatus } from '@/lib/sync-driver';

/** Signing out with taps still waiting asks first: they stay on this phone for the next sign-in. */
export function SignOutButton({ busy, onSignOut }: { busy: boolean; onSignOut: () => void }) {
  const { waiting, phase } = useSyncStatus();
  const [asking, setAsking] = useState(false);
  if (asking && waiting > 0) {
    return (
      <Notice
        tone="warning"
        title={`${waiting === 1 ? '1 tap is' : `${waiting} taps are`} not saved yet.`}
      >
        <p>
          If you sign out now they stay on this phone and are sent the next time you sign in here.
          Nobody else can send them.
        </p>
        <div className="mt-2 flex flex-col gap-2">
          <Button variant="secondary" busy={phase === 'saving'} onClick={() => void syncNow()}>
            Try to save them now
          </Button>
          <Button variant="danger" busy={busy} onClick={onSignOut}>
            Sign out anyway
          </Button>
          <Button variant="quiet" onClick={() => setAsking(false)}>
            Stay signed in
          </Button>
        </div>
      </Notice>
    );
  }
  return (
    <Button
      variant="danger"
      wide
      busy={busy}
      onClick={() => (waiting > 0 ? setAsking(true) : onSignOut())}
    >
      Sign out
    </Button>
  );
}
