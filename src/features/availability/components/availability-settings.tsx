import { useState, type FormEvent } from 'react';
import {
  AVAILABILITY_COLUMNS,
  COLUMN_LABEL,
  type AvailabilityColumn,
} from '#shared/domain/sales/availability';
import type { AvailabilitySettingsView } from '#shared/schemas/listings';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { TextAreaField } from '@/components/ui/text-area-field';
import { useAvailabilityChanges, useAvailabilitySettings } from '../api/availability-api';

/**
 * The public availability list's settings: on or off (off until the keeper turns it on), the
 * columns shown, a note, and its link — copied, or replaced by a new one that retires the old.
 */
export function AvailabilitySettings({ collectionId }: { collectionId: string }) {
  const settings = useAvailabilitySettings(collectionId);
  if (settings.isPending) return <Loading />;
  if (settings.isError) return <Notice tone="error" title={settings.error.message} />;
  return <SettingsForm collectionId={collectionId} initial={settings.data} />;
}

function SettingsForm({
  collectionId,
  initial,
}: {
  collectionId: string;
  initial: AvailabilitySettingsView;
}) {
  const { save, newLink } = useAvailabilityChanges(collectionId);
  const [on, setOn] = useState(initial.on);
  const [columns, setColumns] = useState<AvailabilityColumn[]>(initial.columns);
  const [note, setNote] = useState(initial.note);
  const [copied, setCopied] = useState(false);
  const [confirmNew, setConfirmNew] = useState(false);
  // What the server holds (the mutations write it into the query); the form keeps the typing.
  const data = useAvailabilitySettings(collectionId).data ?? initial;
  const url = data.path ? `${window.location.origin}${data.path}` : null;

  const submit = (e: FormEvent) => {
    e.preventDefault();
    save.mutate({ on, columns, note });
  };
  const toggle = (c: AvailabilityColumn, checked: boolean) =>
    setColumns((now) => AVAILABILITY_COLUMNS.filter((x) => (x === c ? checked : now.includes(x))));

  return (
    <section
      aria-labelledby="availability-list"
      className="flex flex-col gap-3 rounded-2xl border-2 border-border bg-surface p-3"
    >
      <h2 id="availability-list" className="text-xl font-extrabold">
        Public availability list
      </h2>
      <p className="text-muted">
        A read-only page and a CSV for buyers and shops, at its own link. It shows only what is
        available and offered publicly, grouped by species and stage — never codes, places, notes or
        buyers.
      </p>
      <form onSubmit={submit} className="flex flex-col gap-3" noValidate>
        <label className="flex min-h-target items-center gap-3 text-lg font-bold">
          <input
            type="checkbox"
            className="size-6"
            checked={on}
            onChange={(e) => setOn(e.target.checked)}
          />
          Publish the list
        </label>
        <fieldset className="flex flex-col gap-1">
          <legend className="font-bold">Columns</legend>
          <div className="grid grid-cols-2 gap-x-3">
            {AVAILABILITY_COLUMNS.map((c) => (
              <label key={c} className="flex min-h-target items-center gap-3">
                <input
                  type="checkbox"
                  className="size-6"
                  checked={columns.includes(c)}
                  onChange={(e) => toggle(c, e.target.checked)}
                />
                {COLUMN_LABEL[c]}
              </label>
            ))}
          </div>
        </fieldset>
        <TextAreaField
          label="Note on the list"
          hint="Such as when you ship, or how to order."
          value={note}
          maxLength={1000}
          rows={2}
          onChange={(e) => setNote(e.target.value)}
        />
        {save.isError && <Notice tone="error" title={save.error.message} />}
        {save.isSuccess && !save.isPending && <Notice tone="ok" title="Saved." />}
        <Button type="submit" busy={save.isPending} wide>
          Save list settings
        </Button>
      </form>
      {url && (
        <div className="flex flex-col gap-2">
          <label htmlFor="availability-link" className="font-bold">
            Link {data.on ? '' : '(the list is off: this link shows nothing)'}
          </label>
          <input
            id="availability-link"
            readOnly
            value={url}
            className="min-h-target rounded-xl border-2 border-border bg-surface px-3 text-base"
            onFocus={(e) => e.currentTarget.select()}
          />
          <div className="grid grid-cols-2 gap-2">
            <Button
              variant="secondary"
              onClick={() =>
                navigator.clipboard?.writeText(url).then(
                  () => setCopied(true),
                  () => setCopied(false),
                )
              }
            >
              {copied ? 'Copied' : 'Copy link'}
            </Button>
            <Button variant="secondary" onClick={() => setConfirmNew(true)}>
              New link…
            </Button>
          </div>
          {confirmNew && (
            <Notice tone="warning" title="The old link stops working at once.">
              <div className="mt-2 grid grid-cols-2 gap-2">
                <Button
                  busy={newLink.isPending}
                  onClick={() =>
                    newLink.mutate(undefined, {
                      onSuccess: () => {
                        setConfirmNew(false);
                        setCopied(false);
                      },
                    })
                  }
                >
                  Make a new link
                </Button>
                <Button variant="quiet" onClick={() => setConfirmNew(false)}>
                  Keep this one
                </Button>
              </div>
            </Notice>
          )}
          {newLink.isError && <Notice tone="error" title={newLink.error.message} />}
        </div>
      )}
    </section>
  );
}
