import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import {
  HELPER_REPORT_ADVICE,
  HELPER_REPORT_KINDS,
  HELPER_REPORT_WORDS,
  type HelperReportKind,
} from '#shared/domain/helper-reports';
import {
  helperReportBody,
  type HelperReportBody,
  type HelperReportInput,
} from '#shared/schemas/helper-reports';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { TextAreaField } from '@/components/ui/text-area-field';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useSendHelperReport } from '../api/helper-reports';

type Animals = readonly { id: string; name: string; labelCode: string }[];

/** The animal select's two choices that are not an animal on the round. */
const NONE = '';
const OFF_ROUND = 'off-round';

/**
 * A helper tells the owners what went wrong (or leaves a note): the usual first steps for the
 * chosen case show before anything is sent.
 */
export function ReportProblemForm({
  collectionId,
  animals,
  onClose,
}: {
  collectionId: string;
  animals: Animals;
  onClose: () => void;
}) {
  const send = useSendHelperReport(collectionId);
  const [sent, setSent] = useState(false);
  const [animalChoice, setAnimalChoice] = useState(NONE);
  const { register, handleSubmit, setError, setValue, watch, reset, formState } = useForm<
    HelperReportInput,
    unknown,
    HelperReportBody
  >({
    resolver: zodResolver(helperReportBody),
    defaultValues: { animalId: null, animalText: '', note: '' },
  });
  const { problem, attempt } = useServerProblem(setError);
  const kind = watch('kind') as HelperReportKind | undefined;
  const e = formState.errors;

  const submit = handleSubmit((body) =>
    attempt(async () => {
      await send.mutateAsync(body);
      setSent(true);
    }),
  );

  if (sent)
    return (
      <div className="flex flex-col gap-3">
        <Notice tone="ok" title="Sent. The owner has it now, in the app and by e-mail." />
        <Button
          variant="secondary"
          wide
          onClick={() => {
            reset();
            setAnimalChoice(NONE);
            setSent(false);
          }}
        >
          Send another
        </Button>
        <Button variant="quiet" wide onClick={onClose}>
          Back to the round
        </Button>
      </div>
    );

  return (
    <form className="flex flex-col gap-3" onSubmit={submit} noValidate>
      <ChoiceGroup
        legend="What happened?"
        value={(kind ?? '') as HelperReportKind}
        options={HELPER_REPORT_KINDS}
        onChange={(k) => setValue('kind', k, { shouldValidate: true })}
        render={(k) => HELPER_REPORT_WORDS[k]}
        className="grid-cols-2"
      />
      {e.kind && (
        <p className="text-sm font-bold text-danger">
          <span aria-hidden="true">⚠ </span>
          {e.kind.message}
        </p>
      )}
      {kind && (
        <section
          aria-label="What to do first"
          className="rounded-xl border-2 border-accent bg-surface p-3"
        >
          <h3 className="font-extrabold">What to do first</h3>
          <ul className="ml-5 list-disc">
            {HELPER_REPORT_ADVICE[kind].map((line) => (
              <li key={line}>{line}</li>
            ))}
          </ul>
          <p className="mt-1 text-sm text-muted">
            Usual practice only. Local law and a licensed doctor or vet come first.
          </p>
        </section>
      )}
      <SelectField
        label="Which animal?"
        value={animalChoice}
        onChange={(ev) => {
          const v = ev.target.value;
          setAnimalChoice(v);
          setValue('animalId', v === NONE || v === OFF_ROUND ? null : v);
          if (v !== OFF_ROUND) setValue('animalText', '');
        }}
        error={e.animalId?.message}
        options={[
          { value: NONE, label: 'No particular animal' },
          ...animals.map((a) => ({ value: a.id, label: `${a.name} (${a.labelCode})` })),
          { value: OFF_ROUND, label: 'One not on today’s round' },
        ]}
      />
      {animalChoice === OFF_ROUND && (
        <TextField
          label="Its label code or name"
          error={e.animalText?.message}
          {...register('animalText')}
        />
      )}
      <TextAreaField
        label="What you saw and did"
        rows={4}
        error={e.note?.message}
        {...register('note')}
      />
      {problem && <Notice tone="error" title={problem} />}
      <Button type="submit" wide busy={formState.isSubmitting}>
        Send to the owner
      </Button>
      <Button variant="quiet" wide onClick={onClose}>
        Cancel
      </Button>
    </form>
  );
}
