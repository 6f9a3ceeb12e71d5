import { useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { NoCollection } from '@/app/layout/no-collection';
import { useShell } from '@/app/layout/use-shell';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { useColonies, useColonyChanges } from '@/features/colonies/api/colonies-api';
import { ColonyForm } from '@/features/colonies/components/colony-form';
import { FeederSafety } from '@/features/colonies/components/feeder-safety';
import { useRules } from '@/features/rounds/api/rules';

/** Feeder colonies: each with its stock per size; a new one from the feeder catalogue. */
export function ColoniesRoute() {
  const { collection } = useShell();
  if (!collection) return <NoCollection />;
  if (collection.role === 'helper')
    return <Notice tone="info" title="Feeder colonies are kept by the collection’s keepers." />;
  return <Colonies collectionId={collection.collectionId} />;
}

function Colonies({ collectionId }: { collectionId: string }) {
  const colonies = useColonies(collectionId);
  const rules = useRules(collectionId);
  const { create } = useColonyChanges(collectionId);
  const navigate = useNavigate();
  const [adding, setAdding] = useState(false);
  if (colonies.isPending) return <Loading />;
  if (colonies.isError) return <Notice tone="error" title={colonies.error.message} />;
  const list = colonies.data.colonies;
  return (
    <div className="flex flex-col gap-4">
      <h1 className="text-3xl font-extrabold">Feeder colonies</h1>
      <p className="text-muted">
        Tomorrow’s prep list draws on these: it names the colony to pull from and warns when they
        hold too few. Meals recorded on the round come off their stock.
      </p>
      {list.length === 0 && <p>No colonies yet.</p>}
      <ul className="flex flex-col gap-2">
        {list.map((c) => (
          <li key={c.id}>
            <Link
              to={`/colonies/${c.id}`}
              className="flex min-h-target flex-col rounded-2xl border-2 border-border bg-surface p-3"
            >
              <span className="text-lg font-extrabold underline underline-offset-4">{c.name}</span>
              <span className="text-muted">
                {c.species ? `${c.species} · ` : ''}
                {c.preyType}
              </span>
              <span>
                {c.stock.map((s) => `${s.preySize} ${s.count}`).join(' · ') || 'No sizes'}
              </span>
            </Link>
          </li>
        ))}
      </ul>
      {adding ? (
        <section
          aria-labelledby="new-colony"
          className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3"
        >
          <h2 id="new-colony" className="text-xl font-extrabold">
            New colony
          </h2>
          {rules.data ? (
            <ColonyForm
              feeders={rules.data.rules.feeders}
              busy={create.isPending}
              error={create.error?.message ?? null}
              submitLabel="Add colony"
              onSubmit={(input) =>
                create.mutate(input, { onSuccess: (c) => navigate(`/colonies/${c.id}`) })
              }
            />
          ) : (
            <Loading />
          )}
        </section>
      ) : (
        <Button wide onClick={() => setAdding(true)}>
          Add a colony
        </Button>
      )}
      <FeederSafety />
    </div>
  );
}
