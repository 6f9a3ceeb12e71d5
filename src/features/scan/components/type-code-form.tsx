import { useEffect, useId } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';

/**
 * The label's code typed by hand, in any case and with any spaces, when the camera cannot help.
 * Whatever is typed is read as a label would be, so there is no schema to check it against.
 * What was typed stays in the box (a typo is corrected, not typed again) until `clear` turns true.
 */
export function TypeCodeForm({
  onCode,
  clear,
}: {
  onCode: (text: string) => void;
  /** True when the scanner is back to waiting for a label: the box empties. */
  clear: boolean;
}) {
  const id = useId();
  const { register, handleSubmit, reset, watch } = useForm({ defaultValues: { code: '' } });
  useEffect(() => {
    if (clear) reset();
  }, [clear, reset]);
  const submit = handleSubmit(({ code }) => onCode(code));
  return (
    <form className="flex items-end gap-2" onSubmit={submit}>
      <div className="flex flex-1 flex-col gap-1">
        <label htmlFor={id} className="font-bold">
          Type the code
        </label>
        <input
          id={id}
          placeholder="NL-7K3"
          autoCapitalize="characters"
          autoComplete="off"
          spellCheck={false}
          className="min-h-target w-full rounded-xl border-2 border-border bg-surface px-3 font-mono text-lg uppercase tracking-wider text-text placeholder:normal-case placeholder:text-muted"
          {...register('code')}
        />
      </div>
      <Button type="submit" disabled={!watch('code').trim()}>
        Open
      </Button>
    </form>
  );
}
