import { useState } from 'react';
import { Link } from 'react-router-dom';
import { labelUrl } from '#shared/domain/labels/label-payload';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { nfcAvailable } from '@/lib/web-nfc';
import { useRelabel } from '../api/relabel';
import { NfcWriteTag } from './nfc-write-tag';

interface Props {
  collectionId: string;
  /** The collection's label tag; empty until this phone has learnt it (then no NFC writing). */
  labelTag: string;
  animal: { id: string; name: string; labelCode: string };
}

/** The animal's label: print it again, or give it a new code when the old label is lost or damaged. */
export function LabelPanel({ collectionId, labelTag, animal }: Props) {
  const [confirming, setConfirming] = useState(false);
  const relabel = useRelabel(collectionId, animal.id, () => setConfirming(false));
  return (
    <section
      aria-labelledby="label-heading"
      className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3"
    >
      <h2 id="label-heading" className="text-xl font-extrabold">
        Label <span className="font-mono tracking-wider">{animal.labelCode}</span>
      </h2>
      <p className="text-sm text-muted">
        The code stays the same when {animal.name} moves. A new code is only for a lost or damaged
        label.
      </p>
      <Link
        to="/labels"
        state={{ animalIds: [animal.id] }}
        className="inline-flex min-h-target items-center justify-center rounded-xl border-2 border-border px-4 text-lg font-bold"
      >
        Print this label
      </Link>
      {labelTag && nfcAvailable() && (
        <NfcWriteTag
          key={animal.labelCode}
          url={labelUrl(window.location.origin, labelTag, animal.labelCode)}
          what={`${animal.name} (${animal.labelCode})`}
        />
      )}
      {relabel.isSuccess && (
        <Notice
          tone="ok"
          title={`New code ${relabel.data.labelCode}. Print the new label; the old one no longer opens ${animal.name}.`}
        />
      )}
      {confirming ? (
        <Notice
          tone="warning"
          title={`Give ${animal.name} a new code? The old label will stop working.`}
        >
          <div className="mt-2 flex flex-wrap gap-2">
            <Button busy={relabel.isPending} onClick={() => relabel.mutate()}>
              Make a new code
            </Button>
            <Button variant="secondary" onClick={() => setConfirming(false)}>
              Keep {animal.labelCode}
            </Button>
          </div>
        </Notice>
      ) : (
        <Button variant="quiet" onClick={() => setConfirming(true)}>
          New label code…
        </Button>
      )}
      {relabel.isError && <Notice tone="error" title={relabel.error.message} />}
    </section>
  );
}
