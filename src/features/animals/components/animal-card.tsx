import { Link } from 'react-router-dom';
import { SEX_LABEL, stageLabel } from '#shared/domain/animal-facts';
import { placeShort } from '#shared/domain/places';
import type { AnimalSummary } from '#shared/schemas/animals';
import { CautionBadges } from '@/components/ui/caution-badges';

export function AnimalCard({
  animal,
  linked = false,
  heading: Heading = 'h3',
}: {
  animal: AnimalSummary;
  linked?: boolean;
  /** The animal's own page names it in its main heading. */
  heading?: 'h1' | 'h3';
}) {
  return (
    <article
      className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3"
      aria-label={`${animal.name}, ${animal.labelCode}`}
    >
      <div className="flex items-baseline justify-between gap-2">
        <Heading
          className={Heading === 'h1' ? 'text-3xl font-extrabold' : 'text-xl font-extrabold'}
        >
          {linked ? (
            <Link
              to={`/animals/${animal.id}`}
              className="inline-flex min-h-target items-center underline underline-offset-4"
            >
              {animal.name}
            </Link>
          ) : (
            animal.name
          )}
        </Heading>
        <span className="rounded-md border-2 border-border px-2 font-mono text-base font-bold tracking-wider">
          {animal.labelCode}
        </span>
      </div>
      <p className="text-muted">
        <i lang="la">{animal.scientificName}</i>
        {' · '}
        {stageLabel(animal.group, animal.lifeStage)} · {SEX_LABEL[animal.sex]}
        {' · '}
        <span className="font-bold text-text">{placeShort(animal.location)}</span>
      </p>
      <CautionBadges cautions={animal.cautions} />
    </article>
  );
}
