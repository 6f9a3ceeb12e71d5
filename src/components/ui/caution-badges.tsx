import { CAUTION_LABEL, type Caution } from '#shared/domain/animal-facts';
import { CautionIcon } from './icons';

/** Each caution has its own symbol and word, not only a colour (design language). */
export function CautionBadges({ cautions }: { cautions: readonly Caution[] }) {
  if (!cautions.length) return null;
  return (
    <ul aria-label="Cautions" className="flex flex-wrap gap-1.5">
      {cautions.map((c) => {
        return (
          <li
            key={c}
            className="caution-chip inline-flex items-center gap-1 rounded-lg border-2 border-danger px-2 py-0.5 text-sm font-bold text-danger"
          >
            <CautionIcon caution={c} width={18} height={18} />
            {CAUTION_LABEL[c]}
          </li>
        );
      })}
    </ul>
  );
}
