import type { PrepLineView } from '#shared/schemas/rounds';

const cell = 'px-2 py-2 first:pl-0 last:pr-0';

/**
 * What to pull from the feeder tubs before the walk (R15). Prints cleanly in black and white:
 * fixed column widths and no-wrap headings, so "How many" and "Animals" never run together.
 */
export function PrepList({ lines }: { lines: PrepLineView[] }) {
  if (!lines.length) return <p className="text-muted">No feeders needed.</p>;
  return (
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
        {lines.map((l) => (
          <tr
            key={`${l.preyType}|${l.preySize}`}
            className="break-inside-avoid border-b border-border print:border-black"
          >
            <td className={`${cell} break-words font-bold`}>{l.preyType}</td>
            <td className={`${cell} break-words`}>{l.preySize}</td>
            <td className={`${cell} text-right font-bold tabular-nums`}>
              {l.countMin === l.countMax ? l.countMin : `${l.countMin}–${l.countMax}`}
            </td>
            <td className={`${cell} text-right tabular-nums`}>{l.animals}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
