import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { coverBody } from '#shared/schemas/cover';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { TextField } from '@/components/ui/text-field';
import { useServerProblem } from '@/lib/form-errors';
import { useCoverChanges, useCovers } from '../api/cover-api';
import { CoverCard } from './cover-card';

type Input = z.input<typeof coverBody>;
type Output = z.output<typeof coverBody>;

/** The owner's covers: who, which days, and whether it runs (each a CoverCard); a new one by e-mail. */
export function CoverManager({ collectionId, today }: { collectionId: string; today: string }) {
  const covers = useCovers(collectionId);
  const change = useCoverChanges(collectionId);
  const { register, handleSubmit, setError, setValue, formState } = useForm<Input, unknown, Output>(
    {
      resolver: zodResolver(coverBody),
      defaultValues: { email: '', firstDay: today, lastDay: today, message: '' },
    },
  );
  const { problem, attempt } = useServerProblem(setError);
  const [sent, setSent] = useState<string | null>(null);
  const e = formState.errors;
  const submit = handleSubmit(
    (body) =>
      attempt(async () => {
        setSent(null);
        await change.create.mutateAsync(body);
        setSent(body.email);
        setValue('email', '');
        setValue('message', '');
      }),
    () => setSent(null),
  );
  return (
    <div className="flex flex-col gap-4">
      <form
        className="flex flex-col gap-3 rounded-2xl border-2 border-border p-3"
        onSubmit={submit}
      >
        <h2 className="text-xl font-extrabold">Ask someone to cover</h2>
        <TextField
          label="Their e-mail"
          type="email"
          autoComplete="off"
          error={e.email?.message}
          {...register('email')}
        />
        <div className="grid grid-cols-1 gap-2 sm:grid-cols-2">
          <TextField
            label="First day"
            type="date"
            error={e.firstDay?.message}
            {...register('firstDay')}
          />
          <TextField
            label="Last day"
            type="date"
            error={e.lastDay?.message}
            {...register('lastDay')}
          />
        </div>
        <TextField
          label="Message"
          hint="Shown in the e-mail and on their round."
          error={e.message?.message}
          {...register('message')}
        />
        {problem && <Notice tone="error" title={problem} />}
        {sent && <Notice tone="ok" title={`Invite sent to ${sent}.`} />}
        <Button type="submit" busy={formState.isSubmitting}>
          Send the invite
        </Button>
      </form>
      {covers.isPending && <Loading />}
      {covers.isError && <Notice tone="error" title={covers.error.message} />}
      <ul aria-label="Covers" className="flex flex-col gap-2">
        {covers.data?.covers.map((c) => (
          <CoverCard key={c.id} collectionId={collectionId} cover={c} today={today} />
        ))}
      </ul>
    </div>
  );
}
