import { CAUTION_LABEL, CAUTIONS } from '#shared/domain/animal-facts';
import { CAUTION_GUIDANCE } from '#shared/domain/safety';
import type { RoundItemView } from '#shared/schemas/rounds';
import { CautionIcon } from '@/components/ui/icons';

/**
 * The cautions of a helper's round, each spelled out once at the top rather than on every card
 * (most cards share one or two): its title says what to do, the rest opens on a tap. Each card
 * keeps its short badge with the same symbol.
 */
export function RoundCautions({ items }: { items: readonly RoundItemView[] }) {
  const present = CAUTIONS.map(
    (c) => [c, items.filter((i) => i.animal.cautions.includes(c)).length] as const,
  ).filter(([, n]) => n > 0);
  if (!present.length) return null;
  return (
    <section
      aria-labelledby="round-cautions-heading"
      className="flex flex-col gap-2 rounded-2xl border-4 border-danger bg-surface p-3"
    >
      <h2 id="round-cautions-heading" className="text-xl font-extrabold">
        Cautions on today’s round
      </h2>
      <p className="text-sm">
        Each animal’s card carries the badge of its cautions. Tap one here for what to do.
      </p>
      <ul className="flex flex-col gap-2">
        {present.map(([c, n]) => (
          <li key={c}>
            <details className="rounded-xl border-2 border-danger px-2">
              <summary className="flex min-h-target cursor-pointer items-center gap-2 font-extrabold text-danger">
                <CautionIcon caution={c} width={22} height={22} className="shrink-0" />
                <span className="flex-1">
                  {CAUTION_GUIDANCE[c].title}
                  <span className="font-bold">
                    {' '}
                    · {n} {n === 1 ? 'animal' : 'animals'}
                  </span>
                </span>
              </summary>
              <p className="pb-2">
                <span className="sr-only">{CAUTION_LABEL[c]}: </span>
                {CAUTION_GUIDANCE[c].text}
              </p>
            </details>
          </li>
        ))}
      </ul>
    </section>
  );
}
