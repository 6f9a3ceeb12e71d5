import { useForm } from 'react-hook-form';
import { EVENT_WORDS, type EventKind } from '#shared/domain/event-kinds';
import type { RoundItemView } from '#shared/schemas/rounds';
import { Button } from '@/components/ui/button';

export type Choice = EventKind | 'none';
const CHOICES: Choice[] = ['ate', 'refused', 'prey_left_in', 'skipped', 'none'];
const WORD = (c: Choice) => (c === 'none' ? 'Not now' : EVENT_WORDS[c]);

interface Props {
  label: string;
  /** The shelf's animals still waiting to be fed. */
  list: readonly RoundItemView[];
  /** The choices changed so far, kept by the shelf while the form is closed with Cancel. */
  picks: Record<string, Choice>;
  onPick: (animalId: string, choice: Choice) => void;
  onRecord: (list: { animal: RoundItemView['animal']; kind: EventKind }[]) => Promise<unknown>;
  onClose: () => void;
}

/**
 * "All ate, except …": one choice per animal, every one starting at Ate. Nothing here can be
 * typed wrong (each choice comes from the list), so the form has no schema to check.
 */
export function TrayForm({ label, list, picks: kept, onPick, onRecord, onClose }: Props) {
  const { register, handleSubmit, watch, formState } = useForm<{ picks: Record<string, Choice> }>({
    defaultValues: {
      picks: Object.fromEntries(list.map((i) => [i.animal.id, kept[i.animal.id] ?? 'ate'])),
    },
  });
  const picks = watch('picks');
  const choice = (id: string): Choice => picks[id] ?? 'ate';
  const chosen = list.filter((i) => choice(i.animal.id) !== 'none');
  const ate = chosen.filter((i) => choice(i.animal.id) === 'ate').length;
  const submit = handleSubmit(() =>
    onRecord(
      chosen.map((i) => ({ animal: i.animal, kind: choice(i.animal.id) as EventKind })),
    ).finally(onClose),
  );
  return (
    <form aria-label={`Feed ${label} at once`} className="flex flex-col gap-2" onSubmit={submit}>
      <p className="font-bold">All ate, except the ones you change:</p>
      <ul className="flex flex-col gap-1">
        {list.map((i) => (
          <li key={i.animal.id} className="flex items-center gap-2">
            <label htmlFor={`tray-${i.animal.id}`} className="min-w-0 flex-1 truncate">
              <span className="font-bold">{i.animal.name}</span>{' '}
              <span className="font-mono text-sm">{i.animal.labelCode}</span>
            </label>
            <select
              id={`tray-${i.animal.id}`}
              className="min-h-target rounded-xl border-2 border-border bg-surface px-2 text-base text-text"
              {...register(`picks.${i.animal.id}`, {
                onChange: (e: React.ChangeEvent<HTMLSelectElement>) =>
                  onPick(i.animal.id, e.target.value as Choice),
              })}
            >
              {CHOICES.map((c) => (
                <option key={c} value={c}>
                  {WORD(c)}
                </option>
              ))}
            </select>
          </li>
        ))}
      </ul>
      <Button type="submit" busy={formState.isSubmitting} disabled={!chosen.length}>
        Record {chosen.length}: {ate} ate
        {chosen.length > ate ? `, ${chosen.length - ate} other` : ''}
      </Button>
      <Button variant="quiet" onClick={onClose}>
        Cancel
      </Button>
    </form>
  );
}
