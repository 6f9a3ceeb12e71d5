import { useId, useState } from 'react';
import { Button } from '@/components/ui/button';

/** The label's code typed by hand, in any case and with any spaces, when the camera cannot help. */
export function TypeCodeForm({ onCode }: { onCode: (text: string) => void }) {
  const id = useId();
  const [code, setCode] = useState('');
  return (
    <form
      className="flex items-end gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        onCode(code);
        setCode('');
      }}
    >
      <div className="flex flex-1 flex-col gap-1">
        <label htmlFor={id} className="font-bold">
          Type the code
        </label>
        <input
          id={id}
          value={code}
          onChange={(e) => setCode(e.target.value)}
          placeholder="NL-7K3"
          autoCapitalize="characters"
          autoComplete="off"
          spellCheck={false}
          className="min-h-target w-full rounded-xl border-2 border-border bg-surface px-3 font-mono text-lg uppercase tracking-wider text-text placeholder:normal-case placeholder:text-muted"
        />
      </div>
      <Button type="submit" disabled={!code.trim()}>
        Open
      </Button>
    </form>
  );
}
