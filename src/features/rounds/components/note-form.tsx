import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { EVENT_PAYLOADS } from '#shared/schemas/events';
import { Button } from '@/components/ui/button';
import { TextAreaField } from '@/components/ui/text-area-field';

const noteForm = EVENT_PAYLOADS.note;
type Input = z.input<typeof noteForm>;
type Output = z.output<typeof noteForm>;

interface Props {
  animalName: string;
  /** What was typed before "Less" closed the form: the card keeps it, so it is there again on "More…". */
  draft: string;
  onDraft: (text: string) => void;
  onNote: (payload: Output) => void;
}

/** A note about one animal from its round card, written to the outbox like a tap. */
export function NoteForm({ animalName, draft, onDraft, onNote }: Props) {
  const { register, handleSubmit, reset, watch, formState } = useForm<Input, unknown, Output>({
    resolver: zodResolver(noteForm),
    defaultValues: { text: draft },
  });
  const submit = handleSubmit((payload) => {
    onNote(payload);
    reset({ text: '' });
    onDraft('');
  });
  return (
    <form className="flex flex-col gap-2" onSubmit={submit}>
      <TextAreaField
        label={`Note for ${animalName}`}
        maxLength={2000}
        rows={2}
        error={formState.errors.text?.message}
        {...register('text', {
          onChange: (e: React.ChangeEvent<HTMLTextAreaElement>) => onDraft(e.target.value),
        })}
      />
      <Button type="submit" variant="secondary" disabled={!watch('text').trim()}>
        Save note
      </Button>
    </form>
  );
}
