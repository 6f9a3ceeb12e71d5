import type { PrepLineView } from '#shared/schemas/rounds';

/** What to pull from the feeder tubs before the walk (R15); prints cleanly in black and white. */
export function PrepList({ lines }: { lines: PrepLineView[] }) {
  if (!lines.length) return <p className="text-muted">No feeders needed.</p>;
  return (
    <table className="w-full border-collapse text-left print:text-black">
      <caption className="sr-only">Feeders to pull</caption>
      <thead>
        <tr className="border-b-2 border-border">
          <th scope="col" className="py-2">
            Prey
          </th>
          <th scope="col" className="py-2">
            Size
          </th>
          <th scope="col" className="py-2 text-right">
            How many
          </th>
          <th scope="col" className="py-2 text-right">
            Animals
          </th>
        </tr>
      </thead>
      <tbody>
        {lines.map((l) => (
          <tr key={`${l.preyType}|${l.preySize}`} className="border-b border-border">
            <td className="py-2 font-bold">{l.preyType}</td>
            <td className="py-2">{l.preySize}</td>
            <td className="py-2 text-right font-bold">
              {l.countMin === l.countMax ? l.countMin : `${l.countMin}–${l.countMax}`}
            </td>
            <td className="py-2 text-right">{l.animals}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
