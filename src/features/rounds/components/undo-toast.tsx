import { useEffect } from 'react';
import { Button } from '@/components/ui/button';

const SHOW_FOR_MS = 8_000;

/** "Ate · Bramble saved on this phone. Undo" for a few seconds after a tap. */
export function UndoToast({
  message,
  onUndo,
  onClose,
}: {
  message: string;
  onUndo: () => void;
  onClose: () => void;
}) {
  useEffect(() => {
    const timer = setTimeout(onClose, SHOW_FOR_MS);
    return () => clearTimeout(timer);
  }, [message, onClose]);
  return (
    <div
      role="status"
      className="fixed inset-x-2 bottom-20 z-30 mx-auto flex max-w-xl items-center gap-2 rounded-2xl border-2 border-text bg-surface p-2 pl-3 shadow-lg"
    >
      <p className="flex-1 font-bold">{message}</p>
      <Button
        variant="secondary"
        onClick={() => {
          onUndo();
          onClose();
        }}
      >
        Undo
      </Button>
    </div>
  );
}
