import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { deleteCollectionBody, type DeleteCollectionBody } from '#shared/schemas/collections';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useDeleteCollection } from '../api/delete-collection';

const linkClass =
  'flex min-h-target items-center justify-between rounded-xl border-2 border-border bg-surface px-3 font-bold text-text';

interface Props {
  collectionId: string;
  collectionName: string;
  onDeleted: () => void;
}

/**
 * An owner deletes a collection in two steps: the backup is offered first, then the name is
 * typed out (a slip of the thumb cannot do it). It goes for every member, photos included.
 */
export function DeleteCollection(props: Props) {
  const [open, setOpen] = useState(false);
  return (
    <section aria-labelledby="delete-collection-heading" className="flex flex-col gap-2">
      <h2 id="delete-collection-heading" className="text-xl font-extrabold">
        Delete this collection
      </h2>
      {open ? (
        <ConfirmDeletion {...props} onClose={() => setOpen(false)} />
      ) : (
        <>
          <p className="text-sm text-muted">
            Only an owner can, and only after typing its name. Its backup is offered first.
          </p>
          <Button variant="danger" onClick={() => setOpen(true)}>
            Delete this collection…
          </Button>
        </>
      )}
    </section>
  );
}

/** The second step; closing it forgets what was typed and any failed attempt. */
function ConfirmDeletion({
  collectionId,
  collectionName,
  onDeleted,
  onClose,
}: Props & { onClose: () => void }) {
  const remove = useDeleteCollection(collectionId, onDeleted);
  const { register, handleSubmit, setError, watch, formState } = useForm<DeleteCollectionBody>({
    resolver: zodResolver(deleteCollectionBody),
    defaultValues: { confirmName: '' },
  });
  const { problem, attempt } = useServerProblem(setError);
  const matches = watch('confirmName').trim() === collectionName.trim();
  // Enter in the box must not get round the disabled button.
  const submit = handleSubmit(({ confirmName }) =>
    matches ? attempt(() => remove.mutateAsync(confirmName)) : undefined,
  );
  return (
    <>
      <Notice
        tone="warning"
        title={`Delete “${collectionName}” for everyone? This cannot be undone.`}
      >
        <form className="mt-2 flex flex-col gap-3" onSubmit={submit}>
          <p>
            Every animal, place, history entry, photo, cover and member of it goes. Keep a copy
            first:
          </p>
          <a className={linkClass} href={`/api/collections/${collectionId}/backup`} download>
            1. Download its full backup <span aria-hidden="true">↓</span>
          </a>
          <TextField
            label={`2. Type “${collectionName}” to confirm`}
            error={formState.errors.confirmName?.message}
            autoComplete="off"
            autoCapitalize="none"
            autoCorrect="off"
            spellCheck={false}
            {...register('confirmName')}
          />
          <div className="flex flex-wrap gap-2">
            <Button
              type="submit"
              variant="danger"
              disabled={!matches}
              busy={formState.isSubmitting}
            >
              Delete for everyone
            </Button>
            <Button variant="secondary" onClick={onClose}>
              Keep it
            </Button>
          </div>
        </form>
      </Notice>
      {problem && <Notice tone="error" title={problem} />}
    </>
  );
}
