import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { slingsBody, type EggSacView } from '#shared/schemas/breeding';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useBreedingChanges } from '../api/breeding-api';

/** The API's body with its two numbers as typed. */
const potUpForm = slingsBody.extend({
  count: z.string().transform(Number).pipe(slingsBody.shape.count),
  firstPosition: z.string().transform(Number).pipe(slingsBody.shape.firstPosition),
});
type Input = z.input<typeof potUpForm>;
type Output = z.output<typeof potUpForm>;

interface Props {
  sac: EggSacView;
  collectionId: string;
  /** "slings", "nymphs", "scorplings". */
  young: string;
  /** The new animals' ids, to print their labels. */
  onSlings: (animalIds: string[]) => void;
}

/** One record per pot, numbered in order, with label codes in sequence: all at once or none. */
export function PotUpForm({ sac, collectionId, young, onSlings }: Props) {
  const { slings } = useBreedingChanges(collectionId);
  const { register, handleSubmit, setError, watch, formState } = useForm<Input, unknown, Output>({
    resolver: zodResolver(potUpForm),
    defaultValues: {
      count: String(sac.slingCount ?? sac.eggsWithLegs ?? 24),
      namePrefix: sac.femaleName,
      room: '',
      rack: '',
      shelf: '',
      firstPosition: '1',
    },
  });
  const { problem, attempt } = useServerProblem(setError);
  const e = formState.errors;
  const submit = handleSubmit((body) =>
    attempt(async () => {
      const created = await slings.mutateAsync({ sacId: sac.id, body });
      onSlings(created.animalIds);
    }),
  );
  return (
    <form
      aria-label={`Pot up ${young} from ${sac.clutch}`}
      className="grid grid-cols-2 gap-2"
      onSubmit={submit}
    >
      <TextField
        label="How many"
        inputMode="numeric"
        error={e.count?.message}
        {...register('count')}
      />
      <TextField
        label="Names start with"
        error={e.namePrefix?.message}
        {...register('namePrefix')}
      />
      <TextField label="Room" error={e.room?.message} {...register('room')} />
      <TextField label="Rack" error={e.rack?.message} {...register('rack')} />
      <TextField label="Tray or shelf" error={e.shelf?.message} {...register('shelf')} />
      <TextField
        label="First position"
        inputMode="numeric"
        error={e.firstPosition?.message}
        {...register('firstPosition')}
      />
      <p className="col-span-2 text-sm text-muted">
        One record per pot, numbered in order, codes in sequence, all at once or none. Then print
        their labels.
      </p>
      {problem && (
        <div className="col-span-2">
          <Notice tone="error" title={problem} />
        </div>
      )}
      <Button type="submit" className="col-span-2" busy={formState.isSubmitting}>
        Create {watch('count')} {young}
      </Button>
    </form>
  );
}
