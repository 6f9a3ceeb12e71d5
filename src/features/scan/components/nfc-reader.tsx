import { useEffect, useRef, useState } from 'react';
import type { LabelReading } from '#shared/domain/labels/label-payload';
import { readTag } from '#shared/domain/labels/label-tag';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { nfcProblem, nfcProblemWords, readTags, type NfcProblem } from '@/lib/web-nfc';

type ReaderState =
  | { kind: 'off' }
  | { kind: 'starting' }
  | { kind: 'listening'; unreadable: boolean }
  | { kind: 'failed'; problem: NfcProblem };

interface Props {
  /** Each tag, read the way a scanned QR is read. */
  onReading: (reading: LabelReading) => void;
}

/**
 * "Read NFC tags" beside the camera: NDEFReader.scan, started by the person's tap (the user
 * gesture the permission prompt needs), listening for one tag after another until stopped or
 * the page is left. Rendered only where Web NFC exists.
 */
export function NfcReader({ onReading }: Props) {
  const [state, setState] = useState<ReaderState>({ kind: 'off' });
  const controller = useRef<AbortController | null>(null);
  const onReadingRef = useRef(onReading);
  useEffect(() => {
    onReadingRef.current = onReading;
  }, [onReading]);
  useEffect(() => () => controller.current?.abort(), []);

  const start = async () => {
    controller.current?.abort();
    const own = new AbortController();
    controller.current = own;
    setState({ kind: 'starting' });
    try {
      await readTags(
        (records) => {
          setState({ kind: 'listening', unreadable: false });
          onReadingRef.current(readTag(records));
        },
        () => setState({ kind: 'listening', unreadable: true }),
        own.signal,
      );
      if (!own.signal.aborted) setState({ kind: 'listening', unreadable: false });
    } catch (err) {
      if (controller.current !== own || own.signal.aborted) return;
      setState({ kind: 'failed', problem: nfcProblem(err) });
    }
  };
  const stop = () => {
    controller.current?.abort();
    controller.current = null;
    setState({ kind: 'off' });
  };

  if (state.kind === 'off')
    return (
      <Button variant="secondary" wide onClick={() => void start()}>
        Read NFC tags
      </Button>
    );
  if (state.kind === 'failed') {
    const words = nfcProblemWords(state.problem, 'read');
    return (
      <Notice tone="error" title={words.title}>
        <p>{words.body}</p>
        <Button variant="secondary" className="mt-2" onClick={() => void start()}>
          Try again
        </Button>
      </Notice>
    );
  }
  return (
    <div className="flex flex-col gap-2 rounded-xl border-2 border-border bg-surface p-3">
      <p role="status" className="font-bold">
        {state.kind === 'starting'
          ? 'Starting NFC…'
          : 'Reading NFC tags · hold a tag to the back of the phone'}
      </p>
      {state.kind === 'listening' && state.unreadable && (
        <p className="text-sm">
          That tag could not be read. Hold it still against the back of the phone; a tag that was
          never written holds no address.
        </p>
      )}
      <Button variant="secondary" onClick={stop}>
        Stop reading NFC
      </Button>
    </div>
  );
}
