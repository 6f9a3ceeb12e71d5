import { useLocation } from 'react-router-dom';
import { clockTime } from '#shared/domain/local-dates';
import { NoCollection } from '@/app/layout/no-collection';
import { useShell } from '@/app/layout/use-shell';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { useAnimalList } from '@/features/animals/api/list-animals';
import { LabelsWorkbench } from '@/features/labels/components/labels-workbench';

export function LabelsRoute() {
  const { collection } = useShell();
  const location = useLocation();
  const keeper = !!collection && collection.role !== 'helper';
  const list = useAnimalList(collection?.collectionId ?? '', keeper);
  if (!collection) return <NoCollection />;
  if (!keeper)
    return <Notice tone="info" title="Labels are printed by the collection’s keepers." />;
  if (!collection.labelTag)
    return (
      <Notice
        tone="info"
        title="Connect once so this phone learns the collection’s label tag, then print."
      />
    );
  if (list.isPending) return <Loading label="Loading animals…" />;
  if (list.isError) return <Notice tone="error" title={list.error.message} />;
  const preselected = (location.state as { animalIds?: string[] } | null)?.animalIds ?? [];
  return (
    <div className="flex flex-col gap-3">
      <h1 className="text-3xl font-extrabold">Labels</h1>
      {list.data.offlineSince && (
        <p className="text-sm font-bold text-muted">
          No signal · the animal list is this phone’s copy from{' '}
          {clockTime(list.data.offlineSince, collection.timeZone)}
        </p>
      )}
      <LabelsWorkbench
        collectionId={collection.collectionId}
        labelTag={collection.labelTag}
        timeZone={collection.timeZone}
        animals={list.data.animals}
        preselected={preselected}
      />
    </div>
  );
}
