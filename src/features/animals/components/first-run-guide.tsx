import { Link } from 'react-router-dom';

const STEPS = [
  {
    title: 'Add your animals',
    text: 'One at a time: name, species, stage and where it lives on the rack.',
    to: '/animals/new',
    action: 'Add an animal',
  },
  {
    title: 'Or import a spreadsheet',
    text: 'A CSV file with a row per animal, from the list you keep now.',
    to: '/import',
    action: 'Import a CSV file',
  },
  {
    title: 'Print labels',
    text: 'A QR code on each enclosure opens its round card and its record from your phone.',
    to: '/labels',
    action: 'Print labels',
  },
] as const;

/**
 * What a new, empty collection shows instead of an empty round: there is nothing to do yet
 * because there is nothing in it, so the first steps are offered, each one tap away.
 */
export function FirstRunGuide({ collectionName }: { collectionName: string }) {
  return (
    <section
      aria-labelledby="first-run-heading"
      className="flex flex-col gap-3 rounded-2xl border-2 border-primary bg-surface p-4"
    >
      <h2 id="first-run-heading" className="text-2xl font-extrabold">
        Start {collectionName}
      </h2>
      <p>
        There are no animals in this collection yet, so the round is empty. Once they are in, each
        day’s feeds, water and checks appear here on their own.
      </p>
      <ol className="flex flex-col gap-3">
        {STEPS.map((step, i) => (
          <li key={step.to} className="flex gap-3">
            <span
              aria-hidden="true"
              className="flex size-9 shrink-0 items-center justify-center rounded-full bg-primary text-lg font-extrabold text-on-primary"
            >
              {i + 1}
            </span>
            <div className="flex flex-1 flex-col gap-1">
              <h3 className="text-lg font-extrabold">{step.title}</h3>
              <p className="text-muted">{step.text}</p>
              <Link
                to={step.to}
                className={`inline-flex min-h-target items-center justify-center self-start rounded-xl border-2 px-4 text-lg font-bold ${i === 0 ? 'border-primary bg-primary text-on-primary' : 'border-border'}`}
              >
                {step.action}
              </Link>
            </div>
          </li>
        ))}
      </ol>
    </section>
  );
}
