import {
  flexRender,
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type RowSelectionState,
  type SortingState,
  type VisibilityState,
} from '@tanstack/react-table';
import { useWindowVirtualizer } from '@tanstack/react-virtual';
import { memo, useEffect, useMemo, useState, useSyncExternalStore } from 'react';
import { Link } from 'react-router-dom';
import {
  ANIMAL_GROUPS,
  ANIMAL_STATUSES,
  CAUTION_LABEL,
  CAUTIONS,
  GROUP_LABEL,
  LIFE_STAGES,
  SEX_LABEL,
  STAGE_LABEL,
  stageLabel,
  STATUS_LABEL,
} from '#shared/domain/animal-facts';
import { placeShort, rackName } from '#shared/domain/places';
import { formatSize, type SizeUnit } from '#shared/domain/units';
import type { AnimalSummary } from '#shared/schemas/animals';
import { CautionIcon } from '@/components/ui/icons';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useScrollMargin, windowPadding } from '@/lib/use-scroll-margin';
import { activeFilterCount, filterAnimals, NO_FILTERS, type TableFilters } from '../table-filters';

const COLUMNS_KEY = 'rackside.table-columns';
const OPTIONAL_COLUMNS = {
  commonName: 'Common name',
  sex: 'Sex',
  size: 'Leg span',
  place: 'Place',
  cautions: 'Cautions',
  status: 'Status',
  added: 'Added',
} as const;
type OptionalColumn = keyof typeof OPTIONAL_COLUMNS;
const DEFAULT_VISIBLE: VisibilityState = {
  commonName: false,
  sex: false,
  size: true,
  place: true,
  cautions: true,
  status: false,
  added: false,
};

function loadVisibility(): VisibilityState {
  try {
    return {
      ...DEFAULT_VISIBLE,
      ...(JSON.parse(localStorage.getItem(COLUMNS_KEY) ?? '{}') as VisibilityState),
    };
  } catch {
    return DEFAULT_VISIBLE;
  }
}

/** Under 640 px wide the table becomes a list of cards (design language: mobile first). */
const narrowQuery = '(max-width: 639px)';
function useNarrow() {
  return useSyncExternalStore(
    (notify) => {
      const m = window.matchMedia(narrowQuery);
      m.addEventListener('change', notify);
      return () => m.removeEventListener('change', notify);
    },
    () => window.matchMedia(narrowQuery).matches,
    () => true,
  );
}

interface Props {
  animals: readonly AnimalSummary[];
  dueToday: ReadonlySet<string>;
  unit: SizeUnit;
  timeZone: string;
  /** The ticked animals' ids, for the bulk actions the route offers. */
  onSelection: (ids: string[]) => void;
}

const CautionMarks = memo(function CautionMarks({
  cautions,
}: {
  cautions: AnimalSummary['cautions'];
}) {
  return (
    <span className="inline-flex gap-1 text-danger">
      {cautions.map((c) => (
        <CautionIcon
          key={c}
          caution={c}
          width={20}
          height={20}
          aria-hidden={false}
          role="img"
          aria-label={CAUTION_LABEL[c]}
        />
      ))}
    </span>
  );
});

export function AnimalTable({ animals, dueToday, unit, timeZone, onSelection }: Props) {
  const [filters, setFilters] = useState<TableFilters>(NO_FILTERS);
  const [sorting, setSorting] = useState<SortingState>([]);
  const [visibility, setVisibility] = useState<VisibilityState>(loadVisibility);
  const [selection, setSelection] = useState<RowSelectionState>({});
  const narrow = useNarrow();
  // Filters fold away on a phone (the list comes first) and stand open on a wide screen.
  const [filtersOpen, setFiltersOpen] = useState(
    () => typeof window !== 'undefined' && window.matchMedia('(min-width: 1024px)').matches,
  );
  const activeFilters = activeFilterCount(filters);
  const set = (patch: Partial<TableFilters>) => setFilters((f) => ({ ...f, ...patch }));
  const rows = useMemo(
    () => filterAnimals(animals, filters, dueToday),
    [animals, filters, dueToday],
  );
  const racks = useMemo(
    () => [...new Set(animals.flatMap((a) => (a.location ? [a.location.rack] : [])))].sort(),
    [animals],
  );
  const added = useMemo(
    () => new Intl.DateTimeFormat(undefined, { timeZone, dateStyle: 'medium' }),
    [timeZone],
  );

  const columns = useMemo<ColumnDef<AnimalSummary>[]>(
    () => [
      {
        id: 'select',
        enableSorting: false,
        header: ({ table }) => (
          <input
            type="checkbox"
            aria-label="Choose all shown"
            className="size-6 accent-[var(--c-primary)]"
            checked={table.getIsAllRowsSelected()}
            onChange={table.getToggleAllRowsSelectedHandler()}
          />
        ),
        cell: ({ row }) => (
          <input
            type="checkbox"
            aria-label={`Choose ${row.original.name}`}
            className="size-6 accent-[var(--c-primary)]"
            checked={row.getIsSelected()}
            onChange={row.getToggleSelectedHandler()}
          />
        ),
      },
      {
        id: 'code',
        header: 'Code',
        accessorFn: (a) => a.labelCode,
        cell: ({ getValue }) => (
          <span className="whitespace-nowrap font-mono font-bold tracking-wider">
            {getValue<string>()}
          </span>
        ),
      },
      {
        id: 'name',
        header: 'Name',
        accessorFn: (a) => a.name,
        cell: ({ row }) => (
          <Link
            to={`/animals/${row.original.id}`}
            className="inline-flex min-h-target min-w-target items-center font-bold underline underline-offset-4"
          >
            {row.original.name}
          </Link>
        ),
      },
      {
        id: 'species',
        header: 'Species',
        accessorFn: (a) => a.scientificName,
        cell: ({ getValue }) => <i lang="la">{getValue<string>()}</i>,
      },
      { id: 'commonName', header: 'Common name', accessorFn: (a) => a.commonName ?? '' },
      {
        id: 'stage',
        header: 'Stage',
        accessorFn: (a) => LIFE_STAGES.indexOf(a.lifeStage),
        cell: ({ row }) => stageLabel(row.original.group, row.original.lifeStage),
      },
      { id: 'sex', header: 'Sex', accessorFn: (a) => SEX_LABEL[a.sex] },
      {
        id: 'size',
        header: 'Leg span',
        accessorFn: (a) => a.sizeMm ?? -1,
        cell: ({ row }) => formatSize(row.original.sizeMm, unit),
      },
      {
        id: 'place',
        header: 'Place',
        accessorFn: (a) =>
          a.location ? `${a.location.walkOrder.toString().padStart(6, '0')}` : 'zzz',
        cell: ({ row }) => (
          <span className="whitespace-nowrap">{placeShort(row.original.location)}</span>
        ),
      },
      {
        id: 'cautions',
        header: 'Cautions',
        enableSorting: false,
        cell: ({ row }) => <CautionMarks cautions={row.original.cautions} />,
      },
      { id: 'status', header: 'Status', accessorFn: (a) => STATUS_LABEL[a.status] },
      {
        id: 'added',
        header: 'Added',
        accessorFn: (a) => a.addedAt,
        cell: ({ row }) => added.format(new Date(row.original.addedAt)),
      },
    ],
    [unit, added],
  );

  const table = useReactTable({
    data: rows,
    columns,
    state: { sorting, columnVisibility: visibility, rowSelection: selection },
    getRowId: (a) => a.id,
    onSortingChange: setSorting,
    onColumnVisibilityChange: setVisibility,
    onRowSelectionChange: setSelection,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });
  useEffect(() => {
    try {
      localStorage.setItem(COLUMNS_KEY, JSON.stringify(visibility));
    } catch {
      // The choice just is not remembered.
    }
  }, [visibility]);
  useEffect(
    () => onSelection(Object.keys(selection).filter((id) => selection[id])),
    [selection, onSelection],
  );

  const tableRows = table.getRowModel().rows;
  // The list starts well down the page (heading, search, filters, the chosen-animals bar), and
  // anything above it that opens or closes changes the page's height.
  const { ref: listRef, scrollMargin } = useScrollMargin<HTMLDivElement>(() => document.body);
  const virtualizer = useWindowVirtualizer({
    count: tableRows.length,
    estimateSize: () => (narrow ? 124 : 56),
    overscan: 6,
    scrollMargin,
  });
  const items = virtualizer.getVirtualItems();
  const { padTop, padBottom } = windowPadding(items, virtualizer.getTotalSize(), scrollMargin);
  const any = (word: string, values: readonly string[], named: (v: string) => string) => [
    { value: '', label: word },
    ...values.map((v) => ({ value: v, label: named(v) })),
  ];

  return (
    <div className="flex flex-col gap-3">
      <TextField
        label="Find"
        type="search"
        placeholder="Code, name or species"
        value={filters.search}
        onChange={(e) => set({ search: e.target.value })}
        autoComplete="off"
      />
      <details
        open={filtersOpen}
        onToggle={(e) => setFiltersOpen(e.currentTarget.open)}
        className="rounded-xl border-2 border-border p-2"
      >
        <summary className="flex min-h-target cursor-pointer items-center gap-2 font-bold">
          Filters
          {activeFilters > 0 && (
            <span className="rounded-full bg-primary px-2 text-sm text-on-primary">
              {activeFilters} on
            </span>
          )}
        </summary>
        <div className="flex flex-col gap-2 pt-1">
          <div className="grid grid-cols-2 gap-2 min-[640px]:grid-cols-3 lg:grid-cols-6">
            <SelectField
              label="Stage"
              value={filters.stage}
              onChange={(e) => set({ stage: e.target.value as TableFilters['stage'] })}
              options={any(
                'Any stage',
                LIFE_STAGES,
                (s) => STAGE_LABEL[s as keyof typeof STAGE_LABEL],
              )}
            />
            <SelectField
              label="Group"
              value={filters.group}
              onChange={(e) => set({ group: e.target.value as TableFilters['group'] })}
              options={any(
                'Any group',
                ANIMAL_GROUPS,
                (g) => GROUP_LABEL[g as keyof typeof GROUP_LABEL],
              )}
            />
            <SelectField
              label="Status"
              value={filters.status}
              onChange={(e) => set({ status: e.target.value as TableFilters['status'] })}
              options={[
                { value: 'kept', label: 'Kept now' },
                { value: '', label: 'All, retired too' },
                ...ANIMAL_STATUSES.filter((s) => s !== 'active').map((s) => ({
                  value: s,
                  label: STATUS_LABEL[s],
                })),
              ]}
            />
            <SelectField
              label="Rack"
              value={filters.rack}
              onChange={(e) => set({ rack: e.target.value })}
              options={any('Any rack', racks, rackName)}
            />
            <SelectField
              label="Caution"
              value={filters.caution}
              onChange={(e) => set({ caution: e.target.value as TableFilters['caution'] })}
              options={any('Any', CAUTIONS, (c) => CAUTION_LABEL[c as keyof typeof CAUTION_LABEL])}
            />
            <label className="flex min-h-target cursor-pointer items-center gap-3 self-end font-bold">
              <input
                type="checkbox"
                checked={filters.dueToday}
                onChange={(e) => set({ dueToday: e.target.checked })}
                className="size-6 accent-[var(--c-primary)]"
              />
              Due today
            </label>
          </div>
          {activeFilters > 0 && (
            <button
              type="button"
              onClick={() => setFilters((f) => ({ ...NO_FILTERS, search: f.search }))}
              className="inline-flex min-h-target items-center self-start rounded-xl border-2 border-border px-4 font-bold"
            >
              Clear filters
            </button>
          )}
        </div>
      </details>
      {!narrow && (
        <details className="rounded-xl border-2 border-border p-2">
          <summary className="flex min-h-target cursor-pointer items-center font-bold">
            Columns
          </summary>
          <div className="grid grid-cols-2 gap-1">
            {(Object.keys(OPTIONAL_COLUMNS) as OptionalColumn[]).map((c) => (
              <label key={c} className="flex min-h-target cursor-pointer items-center gap-3">
                <input
                  type="checkbox"
                  checked={table.getColumn(c)?.getIsVisible() ?? false}
                  onChange={table.getColumn(c)?.getToggleVisibilityHandler()}
                  className="size-6 accent-[var(--c-primary)]"
                />
                {OPTIONAL_COLUMNS[c]}
              </label>
            ))}
          </div>
        </details>
      )}
      <p aria-live="polite" className="text-muted">
        {rows.length} of {animals.length} animals
        {Object.keys(selection).length > 0 && ` · ${Object.keys(selection).length} chosen`}
      </p>
      <div ref={listRef}>
        {narrow ? (
          <ul
            aria-label="Animals"
            className="flex flex-col"
            style={{ paddingTop: padTop, paddingBottom: padBottom }}
          >
            {items.map((v) => {
              const row = tableRows[v.index]!;
              const a = row.original;
              return (
                <li
                  key={row.id}
                  data-index={v.index}
                  ref={virtualizer.measureElement}
                  className="pb-2"
                >
                  <div className="flex gap-2 rounded-2xl border-2 border-border bg-surface p-2">
                    <label className="flex min-h-target min-w-target cursor-pointer items-start justify-center pt-2">
                      <input
                        type="checkbox"
                        aria-label={`Choose ${a.name}`}
                        className="size-6 accent-[var(--c-primary)]"
                        checked={row.getIsSelected()}
                        onChange={row.getToggleSelectedHandler()}
                      />
                    </label>
                    <div className="min-w-0 flex-1">
                      <p className="flex items-center justify-between gap-2">
                        <Link
                          to={`/animals/${a.id}`}
                          className="inline-flex min-h-target min-w-target items-center truncate text-lg font-extrabold underline underline-offset-4"
                        >
                          {a.name}
                        </Link>
                        <span className="font-mono font-bold tracking-wider">{a.labelCode}</span>
                      </p>
                      <p className="text-sm text-muted">
                        <i lang="la">{a.scientificName}</i> · {stageLabel(a.group, a.lifeStage)} ·{' '}
                        <span className="font-bold text-text">{placeShort(a.location)}</span>
                        {a.status !== 'active' && ` · ${STATUS_LABEL[a.status]}`}
                      </p>
                      <CautionMarks cautions={a.cautions} />
                    </div>
                  </div>
                </li>
              );
            })}
          </ul>
        ) : (
          <table className="w-full border-collapse text-left">
            <thead>
              {table.getHeaderGroups().map((g) => (
                <tr key={g.id} className="border-b-2 border-border">
                  {g.headers.map((h) => (
                    <th
                      key={h.id}
                      scope="col"
                      aria-sort={
                        h.column.getIsSorted() === 'asc'
                          ? 'ascending'
                          : h.column.getIsSorted() === 'desc'
                            ? 'descending'
                            : undefined
                      }
                      className="p-1"
                    >
                      {h.column.getCanSort() ? (
                        <button
                          type="button"
                          onClick={h.column.getToggleSortingHandler()}
                          className="inline-flex min-h-target items-center gap-1 font-extrabold"
                        >
                          {flexRender(h.column.columnDef.header, h.getContext())}
                          <span aria-hidden="true">
                            {{ asc: '▲', desc: '▼' }[h.column.getIsSorted() as string] ?? ''}
                          </span>
                        </button>
                      ) : (
                        flexRender(h.column.columnDef.header, h.getContext())
                      )}
                    </th>
                  ))}
                </tr>
              ))}
            </thead>
            <tbody>
              {padTop > 0 && <tr style={{ height: padTop }} aria-hidden="true" />}
              {items.map((v) => {
                const row = tableRows[v.index]!;
                return (
                  <tr
                    key={row.id}
                    data-index={v.index}
                    ref={virtualizer.measureElement}
                    className="border-b border-border"
                  >
                    {row.getVisibleCells().map((cell) => (
                      <td key={cell.id} className="p-1">
                        {flexRender(cell.column.columnDef.cell, cell.getContext())}
                      </td>
                    ))}
                  </tr>
                );
              })}
              {padBottom > 0 && <tr style={{ height: padBottom }} aria-hidden="true" />}
            </tbody>
          </table>
        )}
      </div>
    </div>
  );
}
