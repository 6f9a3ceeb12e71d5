import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';

/** The end of a small action form: its error, if any, then the action and Cancel. */
export function PanelActions({
  word,
  busy,
  error,
  onCancel,
}: {
  word: string;
  busy: boolean;
  error: string | null;
  onCancel: () => void;
}) {
  return (
    <>
      {error && <Notice tone="error" title={error} />}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" busy={busy}>
          {word}
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </>
  );
}
