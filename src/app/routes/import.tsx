import { useMemo } from 'react';
import { useShell } from '@/app/layout/use-shell';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { useAnimalList } from '@/features/animals/api/list-animals';
import { CsvImport } from '@/features/animals/components/csv-import';
import { useSizeUnit } from '@/lib/preferences';

export function ImportRoute() {
  const { collection } = useShell();
  const keeper = !!collection && collection.role !== 'helper';
  const list = useAnimalList(collection?.collectionId ?? '', keeper);
  const [sizeUnit] = useSizeUnit();
  // One array per list answer, so the import does not check every row again on each render.
  const takenCodes = useMemo(() => list.data?.animals.map((a) => a.labelCode) ?? [], [list.data]);
  if (!collection || !keeper)
    return <Notice tone="info" title="Imports are for the collection’s keepers." />;
  if (list.isPending) return <Loading />;
  return (
    <div className="flex flex-col gap-3">
      <h1 className="text-3xl font-extrabold">Import animals</h1>
      <p>
        From a spreadsheet saved as CSV: one animal per row, and a first row naming the columns in
        your own words. Places named in the file (room, rack, shelf, position) are added when they
        are new.
      </p>
      <CsvImport
        collectionId={collection.collectionId}
        takenCodes={takenCodes}
        sizeUnit={sizeUnit}
      />
    </div>
  );
}
