import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { useSyncStatus } from '@/lib/sync-driver';
import { useLeaveCollection } from '../api/leave-collection';

/**
 * A keeper (or a co-owner, while another owner stays) may step out of a collection; an owner
 * can invite them again.
 */
export function LeaveCollection({
  collectionId,
  collectionName,
  onLeft,
}: {
  collectionId: string;
  collectionName: string;
  onLeft: () => void | Promise<void>;
}) {
  const [sure, setSure] = useState(false);
  const leave = useLeaveCollection(collectionId, onLeft);
  const { waiting } = useSyncStatus();
  return (
    <section aria-label="Leave this collection" className="flex flex-col gap-2">
      {sure ? (
        <Notice
          tone="warning"
          title={`Leave ${collectionName}? You will no longer see its round or its animals.`}
        >
          {waiting > 0 && (
            <p>
              {waiting === 1 ? '1 tap is' : `${waiting} taps are`} not saved yet: save them first,
              they cannot be sent once you have left.
            </p>
          )}
          <div className="mt-2 flex flex-wrap gap-2">
            <Button variant="danger" busy={leave.isPending} onClick={() => leave.mutate()}>
              Leave the collection
            </Button>
            <Button variant="secondary" onClick={() => setSure(false)}>
              Stay
            </Button>
          </div>
        </Notice>
      ) : (
        <Button variant="secondary" onClick={() => setSure(true)}>
          Leave this collection…
        </Button>
      )}
      {leave.isError && <Notice tone="error" title={leave.error.message} />}
    </section>
  );
}
