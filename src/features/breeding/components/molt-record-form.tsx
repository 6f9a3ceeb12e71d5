import { zodResolver } from '@hookform/resolvers/zod';
import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { startOfLocalDate } from '#shared/domain/local-dates';
import { shortDate } from '#shared/domain/rounds/build-round';
import { sizeToMm, type SizeUnit } from '#shared/domain/units';
import { localDate } from '#shared/schemas/common';
import { EVENT_PAYLOADS } from '#shared/schemas/events';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';

const molted = EVENT_PAYLOADS.molted.shape;

/** The size as typed in the keeper's unit, in millimetres for the payload's own bounds. */
const sizeInMm = (unit: SizeUnit) =>
  z
    .string()
    .transform((text, ctx) => {
      if (text.trim() === '') return undefined;
      const size = Number(text.replace(',', '.'));
      if (Number.isNaN(size)) {
        ctx.addIssue({ code: 'custom', message: 'Give the size as a number above 0.' });
        return z.NEVER;
      }
      return sizeToMm(size, unit);
    })
    .pipe(molted.sizeMm);

const moltForm = (unit: SizeUnit) =>
  z.object({
    date: localDate,
    size: sizeInMm(unit),
    exuviaeKept: molted.exuviaeKept.unwrap(),
    sexFromExuviae: molted.sexFromExuviae.unwrap(),
    maturing: molted.maturing.unwrap(),
    note: molted.note.unwrap(),
  });
type Input = z.input<ReturnType<typeof moltForm>>;
type Output = z.output<ReturnType<typeof moltForm>>;

export interface MoltFormProps {
  today: string;
  timeZone: string;
  unit: SizeUnit;
  /** The animal's molts already recorded: a molt on one of these days is completed, not doubled. */
  molts: readonly { eventId: string; date: string }[];
  /**
   * Records the "molted" fact, or with `completes` the details of that molt (through the phone's
   * outbox, so offline too).
   */
  onRecord: (payload: Record<string, unknown>, at: Date, completes?: string) => Promise<unknown>;
  /** On a round card right after the tap: today's molt only, no date to choose. */
  compact?: boolean;
}

/**
 * A molt with what it showed: the size after it, the exuviae's sex, a maturing molt. One molt is
 * one record: on a day that already has a molt, the form completes that molt.
 */
export function MoltRecordForm({
  today,
  timeZone,
  unit,
  molts,
  onRecord,
  compact = false,
}: MoltFormProps) {
  const { register, handleSubmit, setError, resetField, watch, formState } = useForm<
    Input,
    unknown,
    Output
  >({
    resolver: zodResolver(moltForm(unit)),
    defaultValues: {
      date: today,
      size: '',
      exuviaeKept: true,
      sexFromExuviae: 'unknown',
      maturing: false,
      note: '',
    },
  });
  const existing = molts.find((m) => m.date === watch('date'));
  const headingId = useId();
  const [saved, setSaved] = useState<string | null>(null);
  const e = formState.errors;
  const submit = handleSubmit(
    async (v) => {
      setSaved(null);
      // A past day is stored at noon there; today at the moment it is recorded.
      const at =
        v.date === today
          ? new Date()
          : new Date(startOfLocalDate(v.date, timeZone).getTime() + 12 * 3_600_000);
      const payload: Record<string, unknown> = {
        exuviaeKept: v.exuviaeKept,
        sexFromExuviae: v.sexFromExuviae,
        ...(v.maturing ? { maturing: true } : {}),
        ...(v.size !== undefined ? { sizeMm: v.size } : {}),
        ...(v.note ? { note: v.note } : {}),
      };
      // Said as it was when sent: once saved, the day's molt exists and the form would complete it.
      const said = existing ? 'Molt details saved.' : 'Molt recorded.';
      try {
        await onRecord(payload, at, existing?.eventId);
        setSaved(said);
        for (const field of ['size', 'note', 'maturing'] as const) resetField(field);
      } catch (err) {
        // Written to the phone's outbox, not sent: its own message says what went wrong.
        setError('root', { message: (err as Error).message });
      }
    },
    () => setSaved(null),
  );
  return (
    <form
      aria-labelledby={headingId}
      className="flex flex-col gap-2 rounded-2xl border-2 border-border p-3"
      onSubmit={submit}
    >
      <h2 id={headingId} className="text-xl font-extrabold">
        {existing ? `Complete the molt of ${shortDate(existing.date)}` : 'Record a molt'}
      </h2>
      {compact && (
        <p className="text-sm">
          Add what you can now, or later on the animal’s page — a photo of the exuviae too, once
          this molt has synced.
        </p>
      )}
      <div className="grid grid-cols-2 gap-2">
        {!compact && (
          <TextField
            label="Molted on"
            type="date"
            max={today}
            error={e.date?.message}
            {...register('date')}
          />
        )}
        <TextField
          label={`Size after (${unit})`}
          inputMode="decimal"
          error={e.size?.message}
          {...register('size')}
        />
      </div>
      <SelectField
        label="The exuviae shows"
        options={[
          { value: 'unknown', label: 'Not sexed' },
          { value: 'female', label: 'Female' },
          { value: 'male', label: 'Male' },
        ]}
        {...register('sexFromExuviae')}
      />
      <label className="flex min-h-target cursor-pointer items-center gap-3">
        <input
          type="checkbox"
          className="size-6 accent-[var(--c-primary)]"
          {...register('exuviaeKept')}
        />
        Exuviae kept
      </label>
      <label className="flex min-h-target cursor-pointer items-center gap-3">
        <input
          type="checkbox"
          className="size-6 accent-[var(--c-primary)]"
          {...register('maturing')}
        />
        Maturing molt (a mature male: palpal bulbs, often tibial hooks)
      </label>
      <TextField label="Note" error={e.note?.message} {...register('note')} />
      {e.root && <Notice tone="error" title={e.root.message ?? ''} />}
      {saved && <Notice tone="ok" title={saved} />}
      <Button type="submit" busy={formState.isSubmitting}>
        {existing ? 'Save the molt’s details' : 'Record the molt'}
      </Button>
    </form>
  );
}
