import { useShell } from '@/app/layout/use-shell';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { useRules } from '@/features/rounds/api/rules';
import { RulesForm } from '@/features/rounds/components/rules-form';

export function RulesRoute() {
  const { collection } = useShell();
  if (!collection || collection.role === 'helper')
    return <Notice tone="info" title="Rules are for the collection’s owner and keepers." />;
  return <Rules collectionId={collection.collectionId} />;
}

function Rules({ collectionId }: { collectionId: string }) {
  const rules = useRules(collectionId);
  if (rules.isPending) return <Loading label="Loading the rules…" />;
  if (rules.isError) return <Notice tone="error" title={rules.error.message} />;
  return (
    <div className="flex flex-col gap-3">
      <h1 className="text-3xl font-extrabold">Round rules</h1>
      <p className="text-muted">
        How Rackside decides who is fed, with what, and who is left alone. These are husbandry
        reminders from common keeping practice, not veterinary advice; change them to suit your
        animals.
      </p>
      <RulesForm collectionId={collectionId} data={rules.data} />
    </div>
  );
}
