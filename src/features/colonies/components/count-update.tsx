import { useState, type FormEvent } from 'react';
import type { ColonyView, CountUpdateBody } from '#shared/schemas/colonies';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';

const REASONS = ['count', 'split', 'correction'] as const;
const REASON_WORDS: Record<(typeof REASONS)[number], string> = {
  count: 'Colony check',
  split: 'After a split',
  correction: 'Correction',
};

/** A quick count after a colony check: an estimate per size, whole numbers. */
export function CountUpdate({
  colony,
  busy,
  error,
  onSubmit,
}: {
  colony: ColonyView;
  busy: boolean;
  error: string | null;
  onSubmit: (body: CountUpdateBody) => void;
}) {
  const [counts, setCounts] = useState<Record<string, string>>(() =>
    Object.fromEntries(colony.stock.map((s) => [s.preySize, String(s.count)])),
  );
  const [reason, setReason] = useState<(typeof REASONS)[number]>('count');
  const submit = (e: FormEvent) => {
    e.preventDefault();
    onSubmit({
      reason,
      counts: colony.stock.map((s) => ({
        preySize: s.preySize,
        count: Number(counts[s.preySize] ?? s.count),
      })),
    });
  };
  return (
    <form onSubmit={submit} className="flex flex-col gap-3" noValidate>
      <div className="grid grid-cols-2 gap-2">
        {colony.stock.map((s) => (
          <TextField
            key={s.preySize}
            label={s.preySize}
            inputMode="numeric"
            value={counts[s.preySize] ?? ''}
            onChange={(e) => setCounts((now) => ({ ...now, [s.preySize]: e.target.value }))}
          />
        ))}
      </div>
      <ChoiceGroup
        legend="Why"
        value={reason}
        options={REASONS}
        onChange={setReason}
        render={(r) => REASON_WORDS[r]}
        className="grid-cols-3"
      />
      {error && <Notice tone="error" title={error} />}
      <Button type="submit" busy={busy} wide>
        Save counts
      </Button>
    </form>
  );
}
