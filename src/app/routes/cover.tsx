import { localDateOf } from '#shared/domain/local-dates';
import { useShell } from '@/app/layout/use-shell';
import { Notice } from '@/components/ui/notice';
import { useAnimalList } from '@/features/animals/api/list-animals';
import { CoverManager } from '@/features/cover/components/cover-manager';
import { HandoverEditor } from '@/features/cover/components/handover-editor';
import { HelperReportsList } from '@/features/cover/components/helper-reports-list';
import { ReportsList } from '@/features/cover/components/reports-list';

/** Arranging cover: the owner invites helpers; keepers write handover notes; both read the reports. */
export function CoverRoute() {
  const { collection } = useShell();
  const keeper = !!collection && collection.role !== 'helper';
  const animals = useAnimalList(collection?.collectionId ?? '', keeper);
  if (!collection || !keeper)
    return <Notice tone="info" title="Covers are arranged by the collection’s keepers." />;
  const today = localDateOf(new Date(), collection.timeZone);
  return (
    <div className="flex flex-col gap-6">
      <h1 className="text-3xl font-extrabold">Cover for a helper</h1>
      {/* What helpers reported comes first: it may need doing now. */}
      {collection.role === 'owner' && (
        <section
          id="helper-reports"
          aria-labelledby="helper-reports-heading"
          className="flex flex-col gap-2"
        >
          <h2 id="helper-reports-heading" className="text-xl font-extrabold">
            From your helpers
          </h2>
          <HelperReportsList
            collectionId={collection.collectionId}
            timeZone={collection.timeZone}
          />
        </section>
      )}
      {collection.role === 'owner' ? (
        <CoverManager collectionId={collection.collectionId} today={today} />
      ) : (
        <p>The owner invites helpers; you can write the handover notes.</p>
      )}
      <HandoverEditor
        collectionId={collection.collectionId}
        animals={animals.data?.animals.filter((a) => a.status === 'active') ?? []}
        today={today}
      />
      <section aria-labelledby="reports-heading" className="flex flex-col gap-2">
        <h2 id="reports-heading" className="text-xl font-extrabold">
          Daily reports
        </h2>
        <ReportsList collectionId={collection.collectionId} />
      </section>
    </div>
  );
}
