import { useState } from 'react';
import { labelUrl } from '#shared/domain/labels/label-payload';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { NfcWriteTag } from './nfc-write-tag';

interface Props {
  /** The chosen animals, in the order their labels print. */
  labels: readonly { code: string; name: string }[];
  labelTag: string;
  origin: string;
}

/**
 * NFC tags for the chosen labels, one after another: each tag gets the same URL as the QR of
 * that animal's label, and the next animal comes up once a tag is written.
 */
export function NfcTagBatch({ labels, labelTag, origin }: Props) {
  const [written, setWritten] = useState<ReadonlySet<string>>(() => new Set());
  const [picked, setPicked] = useState<string | null>(null);
  const [last, setLast] = useState<{ code: string; name: string } | null>(null);
  const current = labels.find((l) => l.code === picked) ?? labels[0]!;
  const next = (after: string) => {
    const i = labels.findIndex((l) => l.code === after);
    const rest = [...labels.slice(i + 1), ...labels.slice(0, i)];
    return rest.find((l) => !written.has(l.code) && l.code !== after);
  };
  const onWritten = () => {
    setWritten((w) => new Set(w).add(current.code));
    const following = next(current.code);
    // Only a batch moves on; a single tag keeps its own "written" notice.
    if (following) {
      setLast(current);
      setPicked(following.code);
    }
  };
  return (
    <section aria-labelledby="nfc-heading" className="flex flex-col gap-2">
      <h3 id="nfc-heading" className="text-lg font-extrabold">
        NFC tags
      </h3>
      <p className="text-sm text-muted">
        A tag holds the same address as the label’s QR: a phone held to it opens the animal, even
        where a camera fogs. One tag per enclosure, stuck beside the label.
      </p>
      {labels.length > 1 && (
        <SelectField
          label="Tag for"
          value={current.code}
          onChange={(e) => setPicked(e.target.value)}
          options={labels.map((l) => ({
            value: l.code,
            label: `${written.has(l.code) ? '✓ ' : ''}${l.name} (${l.code})`,
          }))}
        />
      )}
      {last && last.code !== current.code && (
        <Notice tone="ok" title={`Tag written for ${last.name} (${last.code}).`}>
          <p>
            {written.size} of {labels.length} written. Next: {current.name} ({current.code}).
          </p>
        </Notice>
      )}
      <NfcWriteTag
        key={current.code}
        url={labelUrl(origin, labelTag, current.code)}
        what={`${current.name} (${current.code})`}
        onWritten={onWritten}
      />
    </section>
  );
}
