import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { useDeleteCollection } from '../api/delete-collection';

const linkClass = 'flex min-h-target items-center justify-between rounded-xl border-2 border-border bg-surface px-3 font-bold text-text';

/**
 * An owner deletes a collection in two steps: the backup is offered first, then the name is
 * typed out (a slip of the thumb cannot do it). It goes for every member, photos included.
 */
export function DeleteCollection({ collectionId, collectionName, onDeleted }: { collectionId: string; collectionName: string; onDeleted: () => void }) {
  const [open, setOpen] = useState(false);
  const [typed, setTyped] = useState('');
  const remove = useDeleteCollection(collectionId, onDeleted);
  const matches = typed.trim() === collectionName.trim();
  const close = () => {
    setOpen(false);
    setTyped('');
    remove.reset();
  };
  return (
    <section aria-labelledby="delete-collection-heading" className="flex flex-col gap-2">
      <h2 id="delete-collection-heading" className="text-xl font-extrabold">
        Delete this collection
      </h2>
      {open ? (
        <Notice tone="warning" title={`Delete “${collectionName}” for everyone? This cannot be undone.`}>
          <form
            className="mt-2 flex flex-col gap-3"
            onSubmit={(e) => {
              e.preventDefault();
              if (matches) remove.mutate(typed.trim());
            }}
          >
            <p>Every animal, place, history entry, photo, cover and member of it goes. Keep a copy first:</p>
            <a className={linkClass} href={`/api/collections/${collectionId}/backup`} download>
              1. Download its full backup <span aria-hidden="true">↓</span>
            </a>
            <TextField
              label={`2. Type “${collectionName}” to confirm`}
              value={typed}
              onChange={(e) => setTyped(e.target.value)}
              autoComplete="off"
              autoCapitalize="none"
              autoCorrect="off"
              spellCheck={false}
            />
            <div className="flex flex-wrap gap-2">
              <Button type="submit" variant="danger" disabled={!matches} busy={remove.isPending}>
                Delete for everyone
              </Button>
              <Button variant="secondary" onClick={close}>
                Keep it
              </Button>
            </div>
          </form>
        </Notice>
      ) : (
        <>
          <p className="text-sm text-muted">Only an owner can, and only after typing its name. Its backup is offered first.</p>
          <Button variant="danger" onClick={() => setOpen(true)}>
            Delete this collection…
          </Button>
        </>
      )}
      {remove.isError && <Notice tone="error" title={remove.error.message} />}
    </section>
  );
}
