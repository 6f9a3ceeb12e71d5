import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { useCoverReports } from '../api/cover-api';

/** Each covered day's report, as e-mailed to the owners (a cover's summary shows on its card). */
export function ReportsList({ collectionId }: { collectionId: string }) {
  const reports = useCoverReports(collectionId);
  if (reports.isPending) return <Loading />;
  if (reports.isError) return <Notice tone="error" title={reports.error.message} />;
  const days = reports.data.reports.filter((r) => !r.coverId);
  if (!days.length)
    return <p className="text-muted">No reports yet: one comes after each covered day.</p>;
  return (
    <ul aria-label="Cover reports" className="flex flex-col gap-2">
      {days.map((r) => (
        <li key={r.id}>
          <details className="rounded-2xl border-2 border-border bg-surface p-2">
            <summary className="flex min-h-target cursor-pointer items-center font-bold">
              {r.subject}
            </summary>
            <pre className="whitespace-pre-wrap font-sans">{r.body}</pre>
          </details>
        </li>
      ))}
    </ul>
  );
}
