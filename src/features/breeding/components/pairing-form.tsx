import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { startOfLocalDate } from '#shared/domain/local-dates';
import { localDate } from '#shared/schemas/common';
import { EVENT_PAYLOADS } from '#shared/schemas/events';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';

const OUTCOMES = [
  { value: 'accepted', label: 'Accepted' },
  { value: 'no_interest', label: 'No interest' },
  { value: 'incident', label: 'Aggression or incident' },
];
const OUTSIDE = 'outside';

const paired = EVENT_PAYLOADS.paired.shape;
/** The form's fields, each checked by the `paired` payload's own rule; a male from elsewhere needs words. */
const pairingForm = z
  .object({
    date: localDate,
    male: paired.maleId.unwrap().or(z.literal(OUTSIDE)),
    outside: paired.outsideMale.unwrap(),
    outcome: paired.outcome.unwrap(),
    note: paired.note.unwrap(),
  })
  .refine((v) => v.male !== OUTSIDE || v.outside !== '', {
    message: 'Describe the male (whose, which species).',
    path: ['outside'],
  });
type Input = z.input<typeof pairingForm>;
type Output = z.output<typeof pairingForm>;

interface Props {
  today: string;
  timeZone: string;
  males: readonly { id: string; name: string; labelCode: string }[];
  onRecord: (payload: Record<string, unknown>, at: Date) => Promise<unknown>;
}

/** A pairing: which male (ours, or someone else's on loan), when, and how it went. */
export function PairingForm({ today, timeZone, males, onRecord }: Props) {
  const { register, handleSubmit, setError, watch, formState } = useForm<Input, unknown, Output>({
    resolver: zodResolver(pairingForm),
    defaultValues: {
      date: today,
      male: males[0]?.id ?? OUTSIDE,
      outside: '',
      outcome: 'accepted',
      note: '',
    },
  });
  const [saved, setSaved] = useState(false);
  const outside = watch('male') === OUTSIDE;
  const e = formState.errors;
  const submit = handleSubmit(
    async (v) => {
      setSaved(false);
      const at =
        v.date === today
          ? new Date()
          : new Date(startOfLocalDate(v.date, timeZone).getTime() + 12 * 3_600_000);
      const payload = {
        ...(v.male === OUTSIDE ? { outsideMale: v.outside } : { maleId: v.male }),
        outcome: v.outcome,
        ...(v.note ? { note: v.note } : {}),
      };
      try {
        await onRecord(payload, at);
        setSaved(true);
      } catch (err) {
        // Written to the phone's outbox, not sent: its own message says what went wrong.
        setError('root', { message: (err as Error).message });
      }
    },
    () => setSaved(false),
  );
  return (
    <form
      aria-labelledby="pairing-heading"
      className="flex flex-col gap-2 rounded-2xl border-2 border-border p-3"
      onSubmit={submit}
    >
      <h2 id="pairing-heading" className="text-xl font-extrabold">
        Record a pairing
      </h2>
      <TextField
        label="Paired on"
        type="date"
        max={today}
        error={e.date?.message}
        {...register('date')}
      />
      <SelectField
        label="Male"
        options={[
          ...males.map((m) => ({ value: m.id, label: `${m.name} (${m.labelCode})` })),
          { value: OUTSIDE, label: 'A male from elsewhere' },
        ]}
        {...register('male')}
      />
      {outside && (
        <TextField
          label="Which male"
          hint="e.g. “Sam’s mature male, on loan”"
          error={e.outside?.message}
          {...register('outside')}
        />
      )}
      <SelectField label="How it went" options={OUTCOMES} {...register('outcome')} />
      <TextField label="Note" error={e.note?.message} {...register('note')} />
      <p className="text-sm text-muted">
        Watch a pairing from start to end, with a catch cup and a card ready to separate them.
      </p>
      {e.root && <Notice tone="error" title={e.root.message ?? ''} />}
      {saved && (
        <Notice tone="ok" title="Pairing recorded: she is now fed more often (rebuilding)." />
      )}
      <Button type="submit" busy={formState.isSubmitting}>
        Record the pairing
      </Button>
    </form>
  );
}
