import { useId } from 'react';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { FILTER_WORDS, ROUND_FILTERS, type RoundFilter } from '../filter-items';

interface Props {
  filter: RoundFilter;
  onFilter: (f: RoundFilter) => void;
  search: string;
  onSearch: (s: string) => void;
  counts: Record<RoundFilter, number>;
}

/**
 * Filter chips (a radio group, so one is always chosen; each counts the animals it shows) and
 * a search for a label code, a place code or a name.
 */
export function RoundFilters({ filter, onFilter, search, onSearch, counts }: Props) {
  const searchId = useId();
  return (
    <div className="flex flex-col gap-2">
      <ChoiceGroup
        legend="Show"
        legendHidden
        className="grid-cols-4"
        value={filter}
        options={ROUND_FILTERS}
        onChange={onFilter}
        render={(f) => (
          <>
            {FILTER_WORDS[f]}
            <span className="font-normal">
              {counts[f]}
              <span className="sr-only"> {counts[f] === 1 ? 'animal' : 'animals'}</span>
            </span>
          </>
        )}
      />
      <label htmlFor={searchId} className="sr-only">
        Find a label code, a place or a name
      </label>
      <input
        id={searchId}
        type="search"
        value={search}
        onChange={(e) => onSearch(e.target.value)}
        placeholder="Find a code, place (A1-2) or name"
        autoComplete="off"
        className="min-h-target rounded-xl border-2 border-border bg-surface px-3 text-lg text-text placeholder:text-muted"
      />
    </div>
  );
}
