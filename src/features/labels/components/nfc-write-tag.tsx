import { useEffect, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { nfcProblem, nfcProblemWords, writeTag, type NfcProblem } from '@/lib/web-nfc';

/** How long the phone waits for a tag before it gives up (a keeper fetching a sticker). */
const WAIT_FOR_TAG_MS = 60_000;

type WriteState =
  | { kind: 'idle' }
  | { kind: 'waiting' }
  | { kind: 'written' }
  | { kind: 'failed'; problem: NfcProblem | 'timeout' };

interface Props {
  /** The label's URL, exactly what its QR holds. */
  url: string;
  /** Whose tag it is, for the words: "Aragog (NL-7K3)". */
  what: string;
  onWritten?: () => void;
}

/**
 * Writes the label's URL to an NFC tag (NDEFReader.write; the tap on the button is the user
 * gesture the permission prompt needs). Rendered only where Web NFC exists.
 */
export function NfcWriteTag({ url, what, onWritten }: Props) {
  const [state, setState] = useState<WriteState>({ kind: 'idle' });
  const controller = useRef<AbortController | null>(null);
  useEffect(() => () => controller.current?.abort(), []);

  const start = async () => {
    controller.current?.abort();
    const own = new AbortController();
    controller.current = own;
    let timedOut = false;
    const timer = setTimeout(() => {
      timedOut = true;
      own.abort();
    }, WAIT_FOR_TAG_MS);
    setState({ kind: 'waiting' });
    try {
      await writeTag({ records: [{ recordType: 'url', data: url }] }, own.signal);
      if (own.signal.aborted) return;
      navigator.vibrate?.(60);
      setState({ kind: 'written' });
      onWritten?.();
    } catch (err) {
      if (controller.current !== own) return;
      const problem = timedOut ? 'timeout' : nfcProblem(err);
      setState({ kind: 'failed', problem });
    } finally {
      clearTimeout(timer);
    }
  };

  if (state.kind === 'waiting')
    return (
      <Notice tone="info" title="Hold the tag to the back of the phone">
        <p>Writing the label’s address for {what}. Keep the tag still until the phone confirms.</p>
        <Button variant="secondary" className="mt-2" onClick={() => controller.current?.abort()}>
          Cancel
        </Button>
      </Notice>
    );
  const button = (word: string) => (
    <Button variant="secondary" wide onClick={() => void start()}>
      {word}
    </Button>
  );
  if (state.kind === 'written')
    return (
      <div className="flex flex-col gap-2">
        <Notice tone="ok" title={`Tag written for ${what}.`}>
          <p>A phone held to it opens the same page as the QR label.</p>
        </Notice>
        {button('Write another tag')}
      </div>
    );
  if (state.kind === 'failed') {
    const words = nfcProblemWords(state.problem, 'write');
    return (
      <div className="flex flex-col gap-2">
        <Notice tone={state.problem === 'cancelled' ? 'info' : 'error'} title={words.title}>
          <p>{words.body}</p>
        </Notice>
        {button(state.problem === 'cancelled' ? 'Write to an NFC tag' : 'Try again')}
      </div>
    );
  }
  return button('Write to an NFC tag');
}
