import { useId } from 'react';
import { FILTER_WORDS, ROUND_FILTERS, type RoundFilter } from '../filter-items';

interface Props {
  filter: RoundFilter;
  onFilter: (f: RoundFilter) => void;
  search: string;
  onSearch: (s: string) => void;
  counts: Record<RoundFilter, number>;
}

/** Filter chips (a radio group, so one is always chosen) and a search for a code or a name. */
export function RoundFilters({ filter, onFilter, search, onSearch, counts }: Props) {
  const searchId = useId();
  return (
    <div className="flex flex-col gap-2">
      <fieldset className="grid grid-cols-4 gap-1">
        <legend className="sr-only">Show</legend>
        {ROUND_FILTERS.map((f) => (
          <label
            key={f}
            className={`flex min-h-target cursor-pointer flex-col items-center justify-center rounded-xl border-2 text-sm font-bold leading-tight has-[:focus-visible]:outline has-[:focus-visible]:outline-4 ${filter === f ? 'border-text bg-text text-bg' : 'border-border bg-surface text-text'}`}
          >
            <input type="radio" name="round-filter" value={f} checked={filter === f} onChange={() => onFilter(f)} className="sr-only" />
            {FILTER_WORDS[f]}
            <span className="font-normal">{counts[f]}</span>
          </label>
        ))}
      </fieldset>
      <label htmlFor={searchId} className="sr-only">
        Find a label code or a name
      </label>
      <input
        id={searchId}
        type="search"
        value={search}
        onChange={(e) => onSearch(e.target.value)}
        placeholder="Find a code or a name"
        autoComplete="off"
        className="min-h-target rounded-xl border-2 border-border bg-surface px-3 text-lg text-text placeholder:text-muted"
      />
    </div>
  );
}
