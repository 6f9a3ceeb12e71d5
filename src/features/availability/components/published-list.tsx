import { COLUMN_LABEL } from '#shared/domain/sales/availability';
import type { PublicAvailability } from '#shared/schemas/listings';

/**
 * The public list: one card per species and stage with the columns the keeper chose. Cards
 * rather than a table, so it reads on a 360 px phone; two or three across on a wide screen.
 */
export function PublishedList({ list, csvHref }: { list: PublicAvailability; csvHref: string }) {
  const shown = list.columns.filter((c) => c !== 'species' && c !== 'commonName');
  return (
    <div className="flex flex-col gap-4">
      {list.note && <p className="whitespace-pre-line text-lg">{list.note}</p>}
      {list.rows.length === 0 ? (
        <p className="text-lg">Nothing is available right now. Please check again later.</p>
      ) : (
        <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
          {list.rows.map((row, i) => (
            <li
              key={i}
              className="flex flex-col gap-1 rounded-2xl border-2 border-border bg-surface p-3"
            >
              {row.species !== undefined && (
                <p className="text-lg font-extrabold">
                  <i>{row.species}</i>
                </p>
              )}
              {row.commonName ? <p className="text-muted">{row.commonName}</p> : null}
              <dl className="grid grid-cols-[auto_1fr] gap-x-3">
                {shown.map((c) => (
                  <div key={c} className="contents">
                    <dt className="font-bold">{COLUMN_LABEL[c]}</dt>
                    <dd>{row[c]}</dd>
                  </div>
                ))}
              </dl>
            </li>
          ))}
        </ul>
      )}
      <a
        href={csvHref}
        download
        className="inline-flex min-h-target items-center justify-center rounded-xl border-2 border-primary bg-primary px-4 text-lg font-bold text-on-primary sm:self-start"
      >
        Download as CSV
      </a>
      <aside aria-label="Before you buy" className="rounded-xl border-2 border-border p-3 text-sm">
        <p>
          Some of these animals can bite, sting or flick irritating hairs. Some species need a
          permit where you live, and carriers have their own rules for live animals: local law and
          the carrier’s terms come first.
        </p>
      </aside>
    </div>
  );
}
