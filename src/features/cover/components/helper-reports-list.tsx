import { useState } from 'react';
import { Link } from 'react-router-dom';
import { HELPER_REPORT_WORDS } from '#shared/domain/helper-reports';
import { clockTime, describeLocalDate, localDateOf } from '#shared/domain/local-dates';
import type { HelperReportView } from '#shared/schemas/helper-reports';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { useHelperReports } from '../api/helper-reports';

function animalOf(r: HelperReportView) {
  if (r.animal) return `${r.animal.name} (${r.animal.labelCode})`;
  return r.animalText || null;
}

function when(r: HelperReportView, timeZone: string) {
  return `${describeLocalDate(localDateOf(new Date(r.createdAt), timeZone))}, ${clockTime(r.createdAt, timeZone)}`;
}

/** One report as the owner reads it. */
function ReportItem({ r, timeZone }: { r: HelperReportView; timeZone: string }) {
  const animal = animalOf(r);
  return (
    <li className="flex flex-col gap-1 rounded-2xl border-2 border-border bg-surface p-3">
      <p className="font-extrabold">
        {HELPER_REPORT_WORDS[r.kind]}
        {animal && <span className="font-bold"> · {animal}</span>}
      </p>
      <p className="whitespace-pre-line">{r.note}</p>
      <p className="text-sm text-muted">
        {r.reportedBy} · {when(r, timeZone)}
      </p>
    </li>
  );
}

/** What helpers reported in the last month, newest first (owners). */
export function HelperReportsList({
  collectionId,
  timeZone,
}: {
  collectionId: string;
  timeZone: string;
}) {
  const reports = useHelperReports(collectionId);
  if (reports.isPending) return <Loading />;
  if (reports.isError) return <Notice tone="error" title={reports.error.message} />;
  if (!reports.data.reports.length)
    return <p className="text-muted">Nothing reported by a helper this past month.</p>;
  return (
    <ul aria-label="Reports from helpers" className="flex flex-col gap-2">
      {reports.data.reports.map((r) => (
        <ReportItem key={r.id} r={r} timeZone={timeZone} />
      ))}
    </ul>
  );
}

/** Reports of the last two days count as news on Today. */
const RECENT_MS = 2 * 86_400_000;

/** A notice on an owner's Today when a helper reported something lately. */
export function RecentHelperReports({
  collectionId,
  timeZone,
}: {
  collectionId: string;
  timeZone: string;
}) {
  const reports = useHelperReports(collectionId);
  // When the screen opened: a notice does not need to age while it is on screen.
  const [openedAt] = useState(() => Date.now());
  const recent =
    reports.data?.reports.filter((r) => openedAt - new Date(r.createdAt).getTime() < RECENT_MS) ??
    [];
  if (!recent.length) return null;
  return (
    <Notice
      tone="warning"
      title={
        recent.length === 1
          ? 'A helper sent you a report'
          : `Helpers sent you ${recent.length} reports`
      }
    >
      <ul className="flex flex-col gap-1">
        {recent.slice(0, 3).map((r) => (
          <li key={r.id}>
            <span className="font-bold">{HELPER_REPORT_WORDS[r.kind]}</span>
            {animalOf(r) && ` · ${animalOf(r)}`} — {r.reportedBy}, {when(r, timeZone)}
          </li>
        ))}
      </ul>
      <Link
        to="/cover#helper-reports"
        className="mt-1 inline-flex min-h-target items-center font-bold underline underline-offset-4"
      >
        Read the reports
      </Link>
    </Notice>
  );
}
