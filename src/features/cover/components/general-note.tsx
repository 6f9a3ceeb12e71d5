import { formatLocalDate } from '#shared/domain/date-words';
import type { HelperCoverView } from '#shared/schemas/cover';

/** The keeper's handover note and the cover's days, at the top of the helper's round. */
export function CoverHeader({ cover }: { cover: HelperCoverView }) {
  return (
    <section
      aria-label="Handover"
      className="flex flex-col gap-2 rounded-2xl border-2 border-accent bg-surface p-3"
    >
      <p className="font-bold">
        You cover {cover.collectionName} until {formatLocalDate(cover.lastDay)}.
      </p>
      {cover.message && <p className="whitespace-pre-line">{cover.message}</p>}
      {cover.generalNote && (
        <details open>
          <summary className="flex min-h-target cursor-pointer items-center font-extrabold">
            Handover note
          </summary>
          <p className="whitespace-pre-line">{cover.generalNote}</p>
        </details>
      )}
    </section>
  );
}
