import { Link } from 'react-router-dom';
import { syncNow, useSyncStatus } from '@/lib/sync-driver';
import { describeSync } from '../describe-sync';
import { useNow } from '../use-now';

/** Always visible: whether taps are waiting, being saved, saved, or need the keeper. */
export function SyncIndicator() {
  const status = useSyncStatus();
  const now = useNow(30_000);
  const text = describeSync(status, now);
  const busy = status.phase === 'saving';
  return (
    <div className="flex items-center gap-2">
      <div className="min-w-0 flex-1">
        <p
          role="status"
          aria-live="polite"
          className={`truncate text-sm font-bold ${text.tone === 'alert' ? 'text-danger' : text.tone === 'waiting' ? 'text-accent' : 'text-text'}`}
        >
          <span aria-hidden="true">{text.symbol} </span>
          {text.words}
        </p>
        {text.detail && <p className="text-xs text-muted">{text.detail}</p>}
        {busy && status.progress && (
          <div
            role="progressbar"
            aria-label="Saving taps"
            aria-valuemin={0}
            aria-valuemax={status.progress.total}
            aria-valuenow={status.progress.sent}
            className="mt-1 h-2 overflow-hidden rounded-full border border-border"
          >
            <div
              className="h-full bg-primary"
              style={{
                width: `${Math.round((status.progress.sent / Math.max(1, status.progress.total)) * 100)}%`,
              }}
            />
          </div>
        )}
      </div>
      {status.phase === 'signed_out' ? (
        <Link
          to="/sign-in"
          className="flex min-h-target items-center rounded-xl border-2 border-danger px-3 font-bold text-danger"
        >
          Sign in
        </Link>
      ) : status.attention > 0 ? (
        <Link
          to="/attention"
          className="flex min-h-target items-center rounded-xl border-2 border-danger px-3 font-bold text-danger"
        >
          See
        </Link>
      ) : (
        <button
          type="button"
          onClick={() => void syncNow()}
          disabled={busy}
          className="min-h-target min-w-target rounded-xl border-2 border-border px-3 font-bold disabled:opacity-60"
        >
          Sync now
        </button>
      )}
    </div>
  );
}
