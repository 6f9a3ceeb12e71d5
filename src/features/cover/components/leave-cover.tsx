import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { leaveCover } from '../api/cover-api';

/** A helper may step down from a cover at any time; the keeper will see it in the covers list. */
export function LeaveCover({ collectionId, onLeft }: { collectionId: string; onLeft: () => void }) {
  const [sure, setSure] = useState(false);
  const leave = useMutation({ mutationFn: () => leaveCover(collectionId), onSuccess: onLeft });
  return (
    <section aria-label="Your cover" className="flex flex-col gap-2">
      {sure ? (
        <Notice tone="warning" title="Leave this cover? You will no longer see the round.">
          <div className="mt-2 flex flex-wrap gap-2">
            <Button variant="danger" busy={leave.isPending} onClick={() => leave.mutate()}>
              Leave the cover
            </Button>
            <Button variant="secondary" onClick={() => setSure(false)}>
              Stay
            </Button>
          </div>
        </Notice>
      ) : (
        <Button variant="secondary" onClick={() => setSure(true)}>
          Leave this cover…
        </Button>
      )}
      {leave.isError && <Notice tone="error" title={leave.error.message} />}
    </section>
  );
}
