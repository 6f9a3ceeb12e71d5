import { useState } from 'react';
import { startOfLocalDate } from '#shared/domain/local-dates';
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

interface Props {
  today: string;
  timeZone: string;
  males: readonly { id: string; name: string; labelCode: string }[];
  onRecord: (payload: Record<string, unknown>, at: Date) => Promise<unknown>;
}

/** A pairing: which male (ours, or someone else's on loan), when, and how it went. */
export function PairingForm({ today, timeZone, males, onRecord }: Props) {
  const [v, setV] = useState({ date: today, male: males[0]?.id ?? OUTSIDE, outside: '', outcome: 'accepted', note: '' });
  const [state, setState] = useState<{ busy: boolean; error: string | null; saved: boolean }>({ busy: false, error: null, saved: false });
  const outside = v.male === OUTSIDE;
  return (
    <form
      aria-labelledby="pairing-heading"
      className="flex flex-col gap-2 rounded-2xl border-2 border-border p-3"
      onSubmit={(e) => {
        e.preventDefault();
        if (outside && !v.outside.trim()) return setState({ busy: false, error: 'Describe the male (whose, which species).', saved: false });
        const at = v.date === today ? new Date() : new Date(startOfLocalDate(v.date, timeZone).getTime() + 12 * 3_600_000);
        const payload = { ...(outside ? { outsideMale: v.outside.trim() } : { maleId: v.male }), outcome: v.outcome, ...(v.note.trim() ? { note: v.note.trim() } : {}) };
        setState({ busy: true, error: null, saved: false });
        onRecord(payload, at).then(
          () => setState({ busy: false, error: null, saved: true }),
          (err: Error) => setState({ busy: false, error: err.message, saved: false }),
        );
      }}
    >
      <h2 id="pairing-heading" className="text-xl font-extrabold">
        Record a pairing
      </h2>
      <TextField label="Paired on" type="date" max={today} value={v.date} onChange={(e) => setV((x) => ({ ...x, date: e.target.value }))} />
      <SelectField label="Male" value={v.male} onChange={(e) => setV((x) => ({ ...x, male: e.target.value }))} options={[...males.map((m) => ({ value: m.id, label: `${m.name} (${m.labelCode})` })), { value: OUTSIDE, label: 'A male from elsewhere' }]} />
      {outside && <TextField label="Which male" hint="e.g. “Sam’s mature male, on loan”" value={v.outside} onChange={(e) => setV((x) => ({ ...x, outside: e.target.value }))} />}
      <SelectField label="How it went" value={v.outcome} onChange={(e) => setV((x) => ({ ...x, outcome: e.target.value }))} options={OUTCOMES} />
      <TextField label="Note" value={v.note} onChange={(e) => setV((x) => ({ ...x, note: e.target.value }))} />
      <p className="text-sm text-muted">Watch a pairing from start to end, with a catch cup and a card ready to separate them.</p>
      {state.error && <Notice tone="error" title={state.error} />}
      {state.saved && <Notice tone="ok" title="Pairing recorded: she is now fed more often (rebuilding)." />}
      <Button type="submit" busy={state.busy}>
        Record the pairing
      </Button>
    </form>
  );
}
