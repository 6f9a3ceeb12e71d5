import { useId, useState } from 'react';
import { startOfLocalDate } from '#shared/domain/local-dates';
import { shortDate } from '#shared/domain/rounds/build-round';
import { sizeToMm, type SizeUnit } from '#shared/domain/units';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';

interface Props {
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
export function MoltForm({ today, timeZone, unit, molts, onRecord, compact = false }: Props) {
  const [v, setV] = useState({ date: today, size: '', kept: true, sex: 'unknown', maturing: false, note: '' });
  const existing = molts.find((m) => m.date === v.date);
  const headingId = useId();
  const [state, setState] = useState<{ busy: boolean; error: string | null; saved: string | null }>({ busy: false, error: null, saved: null });
  const size = v.size.trim() === '' ? null : Number(v.size.replace(',', '.'));
  const sizeError = size !== null && !(size > 0) ? 'Give the size as a number above 0.' : undefined;
  return (
    <form
      aria-labelledby={headingId}
      className="flex flex-col gap-2 rounded-2xl border-2 border-border p-3"
      onSubmit={(e) => {
        e.preventDefault();
        if (sizeError) return;
        // A past day is stored at noon there; today at the moment it is recorded.
        const at = v.date === today ? new Date() : new Date(startOfLocalDate(v.date, timeZone).getTime() + 12 * 3_600_000);
        const payload: Record<string, unknown> = { exuviaeKept: v.kept, sexFromExuviae: v.sex, ...(v.maturing ? { maturing: true } : {}), ...(size !== null ? { sizeMm: sizeToMm(size, unit) } : {}), ...(v.note.trim() ? { note: v.note.trim() } : {}) };
        setState({ busy: true, error: null, saved: null });
        // Said as it was when sent: once saved, the day's molt exists and the form would complete it.
        const saved = existing ? 'Molt details saved.' : 'Molt recorded.';
        onRecord(payload, at, existing?.eventId).then(
          () => (setState({ busy: false, error: null, saved }), setV((x) => ({ ...x, size: '', note: '', maturing: false }))),
          (err: Error) => setState({ busy: false, error: err.message, saved: null }),
        );
      }}
    >
      <h2 id={headingId} className="text-xl font-extrabold">
        {existing ? `Complete the molt of ${shortDate(existing.date)}` : 'Record a molt'}
      </h2>
      {compact && <p className="text-sm">Add what you can now, or later on the animal’s page — a photo of the exuviae too, once this molt has synced.</p>}
      <div className="grid grid-cols-2 gap-2">
        {!compact && <TextField label="Molted on" type="date" max={today} value={v.date} onChange={(e) => setV((x) => ({ ...x, date: e.target.value }))} />}
        <TextField label={`Size after (${unit})`} inputMode="decimal" value={v.size} error={sizeError} onChange={(e) => setV((x) => ({ ...x, size: e.target.value }))} />
      </div>
      <SelectField label="The exuviae shows" value={v.sex} onChange={(e) => setV((x) => ({ ...x, sex: e.target.value }))} options={[{ value: 'unknown', label: 'Not sexed' }, { value: 'female', label: 'Female' }, { value: 'male', label: 'Male' }]} />
      <label className="flex min-h-target cursor-pointer items-center gap-3">
        <input type="checkbox" checked={v.kept} onChange={(e) => setV((x) => ({ ...x, kept: e.target.checked }))} className="size-6 accent-[var(--c-primary)]" />
        Exuviae kept
      </label>
      <label className="flex min-h-target cursor-pointer items-center gap-3">
        <input type="checkbox" checked={v.maturing} onChange={(e) => setV((x) => ({ ...x, maturing: e.target.checked }))} className="size-6 accent-[var(--c-primary)]" />
        Maturing molt (a mature male: palpal bulbs, often tibial hooks)
      </label>
      <TextField label="Note" value={v.note} onChange={(e) => setV((x) => ({ ...x, note: e.target.value }))} />
      {state.error && <Notice tone="error" title={state.error} />}
      {state.saved && <Notice tone="ok" title={state.saved} />}
      <Button type="submit" busy={state.busy}>
        {existing ? 'Save the molt’s details' : 'Record the molt'}
      </Button>
    </form>
  );
}
