import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { generalNoteBody, handoverNoteBody } from '#shared/schemas/cover';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { TextAreaField } from '@/components/ui/text-area-field';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useHandover, useHandoverChanges } from '../api/cover-api';

type Animals = readonly { id: string; name: string; labelCode: string }[];

/** The general note for whoever covers, and notes about single animals until a date. */
export function HandoverEditor({
  collectionId,
  animals,
  today,
}: {
  collectionId: string;
  animals: Animals;
  today: string;
}) {
  const handover = useHandover(collectionId);
  const change = useHandoverChanges(collectionId);
  return (
    <div className="flex flex-col gap-4">
      {handover.data && (
        <GeneralNoteForm
          key={handover.data.generalNote ?? ''}
          initial={handover.data.generalNote ?? ''}
          save={change.general}
        />
      )}
      <AnimalNoteForm animals={animals} today={today} add={change.add} />
      {change.remove.error && <Notice tone="error" title={change.remove.error.message} />}
      <ul aria-label="Notes about animals" className="flex flex-col gap-2">
        {handover.data?.notes.map((n) => (
          <li
            key={n.id}
            className="flex items-center gap-2 rounded-xl border-2 border-border bg-surface p-2"
          >
            <span className="flex-1">
              <span className="font-bold">{n.animalName}</span> until {n.until}
              {n.doNotFeed && ' · do not feed'}: {n.text}
            </span>
            <Button
              variant="danger"
              aria-label={`Remove the note about ${n.animalName}`}
              onClick={() => change.remove.mutate(n.id)}
            >
              ✕
            </Button>
          </li>
        ))}
      </ul>
    </div>
  );
}

type Changes = ReturnType<typeof useHandoverChanges>;
type NoteInput = z.input<typeof handoverNoteBody>;
type NoteOutput = z.output<typeof handoverNoteBody>;

function AnimalNoteForm({
  animals,
  today,
  add,
}: {
  animals: Animals;
  today: string;
  add: Changes['add'];
}) {
  const { register, handleSubmit, setError, setValue, watch, formState } = useForm<
    NoteInput,
    unknown,
    NoteOutput
  >({
    resolver: zodResolver(handoverNoteBody),
    defaultValues: { animalId: '', text: '', until: today, doNotFeed: false },
  });
  const { problem, attempt } = useServerProblem(setError);
  const e = formState.errors;
  const submit = handleSubmit((body) =>
    attempt(async () => {
      await add.mutateAsync(body);
      setValue('text', '');
      setValue('doNotFeed', false);
    }),
  );
  return (
    <form className="flex flex-col gap-2 rounded-2xl border-2 border-border p-3" onSubmit={submit}>
      <h2 className="text-xl font-extrabold">A note about one animal</h2>
      <SelectField
        label="Animal"
        error={e.animalId?.message}
        options={[
          { value: '', label: 'Choose…' },
          ...animals.map((a) => ({ value: a.id, label: `${a.name} (${a.labelCode})` })),
        ]}
        {...register('animalId')}
      />
      <TextField label="Note" error={e.text?.message} {...register('text')} />
      <TextField label="Show until" type="date" error={e.until?.message} {...register('until')} />
      <label className="flex min-h-target cursor-pointer items-center gap-3">
        <input
          type="checkbox"
          className="size-6 accent-[var(--c-primary)]"
          {...register('doNotFeed')}
        />
        Do not feed until then (e.g. premolt)
      </label>
      {problem && <Notice tone="error" title={problem} />}
      <Button
        type="submit"
        disabled={!watch('animalId') || !watch('text').trim()}
        busy={formState.isSubmitting}
      >
        Add the note
      </Button>
    </form>
  );
}

type GeneralInput = z.input<typeof generalNoteBody>;
type GeneralOutput = z.output<typeof generalNoteBody>;

function GeneralNoteForm({ initial, save }: { initial: string; save: Changes['general'] }) {
  const { register, handleSubmit, setError, formState } = useForm<
    GeneralInput,
    unknown,
    GeneralOutput
  >({
    resolver: zodResolver(generalNoteBody),
    defaultValues: { text: initial },
  });
  const { problem, attempt } = useServerProblem(setError);
  const submit = handleSubmit(({ text }) => attempt(() => save.mutateAsync(text)));
  return (
    <form className="flex flex-col gap-2" onSubmit={submit}>
      <TextAreaField
        label="Handover note"
        labelClassName="text-xl font-extrabold"
        hint="Where the feeders and tools are, who to call, what to do if an animal escapes or someone is bitten or stung."
        rows={6}
        error={formState.errors.text?.message}
        {...register('text')}
      />
      {problem && <Notice tone="error" title={problem} />}
      <Button type="submit" variant="secondary" busy={formState.isSubmitting}>
        Save the handover note
      </Button>
      {save.isSuccess && <Notice tone="ok" title="Saved." />}
    </form>
  );
}
