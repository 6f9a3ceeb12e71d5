import { shortWarning, type LineDraw } from '#shared/domain/colonies/stock';
import type { PrepLineView } from '#shared/schemas/rounds';

const cell = 'px-2 py-2 first:pl-0 last:pr-0';

/** A prep line, with the feeder colonies' draw when the collection keeps colonies. */
export type PrepLineWithDraw = PrepLineView & { draw?: LineDraw };

/** "Pull from Dubia bin A (8), Dubia bin B (4)". */
function pullFrom(draw: LineDraw): string | null {
  if (!draw.draws.length) return null;
  return `Pull from ${draw.draws.map((d) => `${d.colonyName} (${d.count})`).join(', ')}`;
}

/**
 * What to pull from the feeder tubs before the walk (R15). Prints cleanly in black and white:
 * fixed column widths and no-wrap headings, so "How many" and "Animals" never run together.
 * With colonies, each line says which to pull from and warns, in words and a symbol, when they
 * hold fewer than the line needs.
 */
export function PrepList({ lines }: { lines: PrepLineWithDraw[] }) {
  if (!lines.length) return <p className="text-muted">No feeders needed.</p>;
  const warnings = lines
    .map((l) => (l.draw ? shortWarning({ ...l, draw: l.draw }) : null))
    .filter((w): w is string => !!w);
  return (
    <div className="flex flex-col gap-2">
      {warnings.length > 0 && (
        <div
          role="status"
          className="rounded-xl border-2 border-danger bg-surface p-3 text-danger print:border-black print:text-black"
        >
          <p className="flex items-start gap-2 font-bold">
            <span aria-hidden="true" className="text-xl leading-6">
              ⚠
            </span>
            <span>
              {warnings.length === 1
                ? 'The colonies run short'
                : `The colonies run short on ${warnings.length} lines`}
            </span>
          </p>
          <ul className="mt-1 list-disc pl-6 text-text print:text-black">
            {warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </div>
      )}
      <table className="w-full table-fixed border-collapse text-left print:text-[12pt] print:text-black">
        <caption className="sr-only">Feeders to pull</caption>
        <colgroup>
          <col className="w-[38%]" />
          <col className="w-[22%]" />
          <col className="w-[20%]" />
          <col className="w-[20%]" />
        </colgroup>
        <thead>
          <tr className="border-b-2 border-border print:border-black">
            <th scope="col" className={`${cell} whitespace-nowrap`}>
              Prey
            </th>
            <th scope="col" className={`${cell} whitespace-nowrap`}>
              Size
            </th>
            <th scope="col" className={`${cell} text-right`}>
              How many
            </th>
            <th scope="col" className={`${cell} text-right`}>
              Animals
            </th>
          </tr>
        </thead>
        <tbody>
          {lines.map((l) => {
            const from = l.draw ? pullFrom(l.draw) : null;
            const short = l.draw?.kept ? l.draw.short : 0;
            return (
              <tr
                key={`${l.preyType}|${l.preySize}`}
                className="break-inside-avoid border-b border-border print:border-black"
              >
                <td className={`${cell} break-words font-bold`}>
                  {l.preyType}
                  {from && (
                    <span className="block text-sm font-normal text-muted print:text-black">
                      {from}
                    </span>
                  )}
                  {short > 0 && (
                    <span className="block text-sm font-bold text-danger print:text-black">
                      <span aria-hidden="true">⚠ </span>
                      {short} short
                    </span>
                  )}
                </td>
                <td className={`${cell} break-words`}>{l.preySize}</td>
                <td className={`${cell} text-right font-bold tabular-nums`}>
                  {l.countMin === l.countMax ? l.countMin : `${l.countMin}–${l.countMax}`}
                </td>
                <td className={`${cell} text-right tabular-nums`}>{l.animals}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
