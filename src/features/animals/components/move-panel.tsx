import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { moveBody, type LocationSummary } from '#shared/schemas/animals';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { useServerProblem } from '@/lib/form-errors';
import { PanelActions } from './panel-actions';

/** Where to and how: the animals themselves are chosen before the panel opens. */
const moveForm = moveBody.pick({ locationId: true, rehoused: true });
type Input = z.input<typeof moveForm>;
type Output = z.output<typeof moveForm>;

/**
 * Moves one animal or many to one place; each move is kept in the animal's history. "Into a new
 * enclosure" marks a rehouse, which starts a settling period (docs/care-rules.md § R16).
 */
export function MovePanel({
  what,
  locations,
  current,
  onMove,
  onCancel,
}: {
  what: string;
  locations: readonly LocationSummary[];
  current?: string | null;
  onMove: (locationId: string, rehoused: boolean) => Promise<unknown>;
  onCancel: () => void;
}) {
  const { register, handleSubmit, setError, formState } = useForm<Input, unknown, Output>({
    resolver: zodResolver(moveForm),
    defaultValues: { locationId: current ?? locations[0]?.id ?? '', rehoused: false },
  });
  const { problem, attempt } = useServerProblem(setError);
  if (!locations.length) return <Notice tone="info" title="Add places first (Animals → Places)." />;
  const submit = handleSubmit((v) => attempt(() => onMove(v.locationId, v.rehoused ?? false)));
  return (
    <form
      className="flex flex-col gap-3 rounded-2xl border-2 border-border bg-surface p-3"
      onSubmit={submit}
    >
      <SelectField
        label={`Move ${what} to`}
        error={formState.errors.locationId?.message}
        options={locations.map((l) => ({
          value: l.id,
          label: `${l.room} · ${l.rack}${l.shelf}-${l.position}`,
        }))}
        {...register('locationId')}
      />
      <label className="flex min-h-target cursor-pointer items-center gap-3 font-bold">
        <input
          type="checkbox"
          className="size-6 accent-[var(--c-primary)]"
          {...register('rehoused')}
        />
        Into a new enclosure (no food for a few days while it settles)
      </label>
      <PanelActions word="Move" busy={formState.isSubmitting} error={problem} onCancel={onCancel} />
    </form>
  );
}
