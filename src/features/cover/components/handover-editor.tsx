import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useHandover, useHandoverChanges } from '../api/cover-api';

/** The general note for whoever covers, and notes about single animals until a date. */
export function HandoverEditor({ collectionId, animals, today }: { collectionId: string; animals: readonly { id: string; name: string; labelCode: string }[]; today: string }) {
  const handover = useHandover(collectionId);
  const change = useHandoverChanges(collectionId);
  const [note, setNote] = useState({ animalId: '', text: '', until: today, doNotFeed: false });
  const error = change.general.error ?? change.add.error ?? change.remove.error;
  return (
    <div className="flex flex-col gap-4">
      {handover.data && <GeneralNoteForm key={handover.data.generalNote ?? ''} initial={handover.data.generalNote ?? ''} save={change.general} />}
      <form
        className="flex flex-col gap-2 rounded-2xl border-2 border-border p-3"
        onSubmit={(e) => {
          e.preventDefault();
          change.add.mutate(note, { onSuccess: () => setNote((n) => ({ ...n, text: '', doNotFeed: false })) });
        }}
      >
        <h2 className="text-xl font-extrabold">A note about one animal</h2>
        <SelectField label="Animal" value={note.animalId} onChange={(e) => setNote((n) => ({ ...n, animalId: e.target.value }))} options={[{ value: '', label: 'Choose…' }, ...animals.map((a) => ({ value: a.id, label: `${a.name} (${a.labelCode})` }))]} />
        <TextField label="Note" value={note.text} onChange={(e) => setNote((n) => ({ ...n, text: e.target.value }))} />
        <TextField label="Show until" type="date" value={note.until} onChange={(e) => setNote((n) => ({ ...n, until: e.target.value }))} />
        <label className="flex min-h-target cursor-pointer items-center gap-3">
          <input type="checkbox" checked={note.doNotFeed} onChange={(e) => setNote((n) => ({ ...n, doNotFeed: e.target.checked }))} className="size-6 accent-[var(--c-primary)]" />
          Do not feed until then (e.g. premolt)
        </label>
        <Button type="submit" disabled={!note.animalId || !note.text.trim()} busy={change.add.isPending}>
          Add the note
        </Button>
      </form>
      {error && <Notice tone="error" title={error.message} />}
      <ul aria-label="Notes about animals" className="flex flex-col gap-2">
        {handover.data?.notes.map((n) => (
          <li key={n.id} className="flex items-center gap-2 rounded-xl border-2 border-border bg-surface p-2">
            <span className="flex-1">
              <span className="font-bold">{n.animalName}</span> until {n.until}
              {n.doNotFeed && ' · do not feed'}: {n.text}
            </span>
            <Button variant="danger" aria-label={`Remove the note about ${n.animalName}`} onClick={() => change.remove.mutate(n.id)}>
              ✕
            </Button>
          </li>
        ))}
      </ul>
    </div>
  );
}

function GeneralNoteForm({ initial, save }: { initial: string; save: ReturnType<typeof useHandoverChanges>['general'] }) {
  const [general, setGeneral] = useState(initial);
  return (
    <form
      className="flex flex-col gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        save.mutate(general);
      }}
    >
      <label htmlFor="general-note" className="text-xl font-extrabold">
        Handover note
      </label>
      <p className="text-sm text-muted">Where the feeders and tools are, who to call, what to do if an animal escapes or someone is bitten or stung.</p>
      <textarea id="general-note" rows={6} value={general} onChange={(e) => setGeneral(e.target.value)} className="rounded-xl border-2 border-border bg-surface p-2 text-lg text-text" />
      <Button type="submit" variant="secondary" busy={save.isPending}>
        Save the handover note
      </Button>
      {save.isSuccess && <Notice tone="ok" title="Saved." />}
    </form>
  );
}
