import { useId } from 'react';
import { Link } from 'react-router-dom';
import { Notice } from '@/components/ui/notice';
import { useRestoreBackup } from '../api/restore-backup';

const linkClass =
  'flex min-h-target items-center justify-between rounded-xl border-2 border-border bg-surface px-3 font-bold';

/** Everything out (CSV and a full backup), and a backup back in (owners, empty collection only). */
export function DataPanel({ collectionId, isOwner }: { collectionId: string; isOwner: boolean }) {
  const fileId = useId();
  const base = `/api/collections/${collectionId}`;
  const restore = useRestoreBackup(collectionId);
  return (
    <section aria-labelledby="data-heading" className="flex flex-col gap-2">
      <h2 id="data-heading" className="text-xl font-extrabold">
        Your data
      </h2>
      <a className={linkClass} href={`${base}/export/animals.csv`} download>
        Animals as CSV <span aria-hidden="true">↓</span>
      </a>
      <a className={linkClass} href={`${base}/export/events.csv`} download>
        History as CSV <span aria-hidden="true">↓</span>
      </a>
      <a className={linkClass} href={`${base}/backup`} download>
        Full backup (JSON, with photos) <span aria-hidden="true">↓</span>
      </a>
      {isOwner && (
        <>
          <label
            htmlFor={fileId}
            className={`${linkClass} cursor-pointer has-[:focus-visible]:outline has-[:focus-visible]:outline-4`}
          >
            {restore.isPending ? 'Restoring…' : 'Restore a backup into this collection'}
            <input
              id={fileId}
              type="file"
              accept="application/json,.json"
              className="sr-only"
              onChange={(e) => {
                const file = e.target.files?.[0];
                if (file) restore.mutate(file);
                e.target.value = '';
              }}
            />
          </label>
          <p className="text-sm text-muted">
            A backup restores only into a collection with no animals or places yet.
          </p>
          <Link to="/collections/new" className={linkClass}>
            Start a new collection for it <span aria-hidden="true">›</span>
          </Link>
        </>
      )}
      {restore.isSuccess && (
        <Notice
          tone="ok"
          title={`Restored ${restore.data.animals} animals and ${restore.data.events} history entries.`}
        />
      )}
      {restore.isError && <Notice tone="error" title={restore.error.message} />}
    </section>
  );
}
