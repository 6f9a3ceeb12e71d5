import { useMemo, useState } from 'react';
import { stageLabel } from '#shared/domain/animal-facts';
import {
  guessColumn,
  IMPORT_COLUMNS,
  REQUIRED_COLUMNS,
  rowToAnimal,
  type AnimalColumn,
} from '#shared/domain/csv/animal-columns';
import { readCsv, type CsvTable } from '#shared/domain/csv/csv-file';
import { codeKey } from '#shared/domain/labels/label-payload';
import { placeName } from '#shared/domain/places';
import { MAX_IMPORT_ROWS } from '#shared/schemas/import';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { useImportAnimals } from '../api/animal-records';

const MAX_FILE_BYTES = 10 * 1024 * 1024;
const SKIP = '';

interface Props {
  collectionId: string;
  /** Codes the collection already uses: a row repeating one is reported, not sent. */
  takenCodes: readonly string[];
}

/** A spreadsheet in: map its columns, see every problem by line, import only the valid rows. */
export function CsvImport({ collectionId, takenCodes }: Props) {
  const [file, setFile] = useState<{ name: string; table: CsvTable } | null>(null);
  const [mapping, setMapping] = useState<(AnimalColumn | typeof SKIP)[]>([]);
  const [readError, setReadError] = useState<string | null>(null);
  const importRows = useImportAnimals(collectionId);

  const open = async (f: File | undefined) => {
    setReadError(null);
    importRows.reset();
    if (!f) return;
    if (f.size > MAX_FILE_BYTES)
      return setReadError('That file is over 10 MB. Split it and import the parts.');
    const table = readCsv(await f.text());
    if (!table.headers.length)
      return setReadError('That file has no header row. The first line should name the columns.');
    if (table.records.length > MAX_IMPORT_ROWS)
      return setReadError(
        `That file has ${table.records.length} rows; import at most ${MAX_IMPORT_ROWS} at a time.`,
      );
    setFile({ name: f.name, table });
    setMapping(table.headers.map((h) => guessColumn(h) ?? SKIP));
  };

  const checked = useMemo(() => {
    if (!file) return null;
    const taken = new Set(takenCodes.map(codeKey));
    const seen = new Set<string>();
    return file.table.records.map((r) => {
      const cells: Partial<Record<AnimalColumn, string>> = {};
      mapping.forEach((column, i) => {
        if (column) cells[column] = r.cells[i] ?? '';
      });
      const result = rowToAnimal(cells);
      const code = result.ok && result.value.labelCode ? codeKey(result.value.labelCode) : '';
      if (code && (taken.has(code) || seen.has(code)))
        return {
          line: r.line,
          result: {
            ok: false as const,
            errors: [`code: ${result.ok ? result.value.labelCode : ''} is already used.`],
          },
        };
      if (code) seen.add(code);
      return { line: r.line, result };
    });
  }, [file, mapping, takenCodes]);

  const missing = REQUIRED_COLUMNS.filter((c) => !mapping.includes(c));
  const valid = checked?.flatMap((c) => (c.result.ok ? [c.result.value] : [])) ?? [];
  const problems = checked?.filter((c) => !c.result.ok) ?? [];

  return (
    <div className="flex flex-col gap-4">
      <label className="flex min-h-target cursor-pointer items-center justify-center rounded-xl border-2 border-border bg-surface px-4 text-lg font-bold has-[:focus-visible]:outline has-[:focus-visible]:outline-4">
        {file ? `Chosen: ${file.name} · choose another` : 'Choose a CSV file'}
        <input
          type="file"
          accept=".csv,text/csv"
          className="sr-only"
          onChange={(e) => void open(e.target.files?.[0])}
        />
      </label>
      {readError && <Notice tone="error" title={readError} />}
      {file && (
        <>
          <section aria-labelledby="map-heading" className="flex flex-col gap-2">
            <h2 id="map-heading" className="text-xl font-extrabold">
              Columns
            </h2>
            <p className="text-muted">
              Each column of your file goes to one of ours. Required: {REQUIRED_COLUMNS.join(', ')}.
            </p>
            {file.table.headers.map((h, i) => (
              <SelectField
                key={`${h}-${i}`}
                label={`“${h}”`}
                value={mapping[i] ?? SKIP}
                onChange={(e) =>
                  setMapping((m) =>
                    m.map((c, j) => (j === i ? (e.target.value as AnimalColumn | typeof SKIP) : c)),
                  )
                }
                options={[
                  { value: SKIP, label: 'Leave out' },
                  ...IMPORT_COLUMNS.map((c) => ({ value: c, label: c })),
                ]}
              />
            ))}
            {missing.length > 0 && (
              <Notice tone="warning" title={`Map a column to: ${missing.join(', ')}.`} />
            )}
          </section>
          {missing.length === 0 && checked && (
            <section aria-labelledby="check-heading" className="flex flex-col gap-2">
              <h2 id="check-heading" className="text-xl font-extrabold">
                Check
              </h2>
              <p aria-live="polite" className="font-bold">
                {valid.length} of {checked.length} rows are ready
                {problems.length ? `; ${problems.length} need attention` : ''}.
              </p>
              {problems.length > 0 && (
                <ul
                  aria-label="Rows with problems"
                  className="flex flex-col gap-1 rounded-xl border-2 border-danger p-2"
                >
                  {problems.map((p) => (
                    <li key={p.line}>
                      <span className="font-bold">Line {p.line}:</span>{' '}
                      {!p.result.ok && p.result.errors.join(' ')}
                    </li>
                  ))}
                </ul>
              )}
              {valid.length > 0 && (
                <ul aria-label="Preview" className="flex flex-col gap-1 text-sm">
                  {valid.slice(0, 5).map((v, i) => (
                    <li key={i}>
                      <span className="font-bold">{v.name}</span> ·{' '}
                      <i lang="la">{v.scientificName}</i> · {stageLabel(v.group, v.lifeStage)}
                      {v.place && ` · ${placeName(v.place)}`}
                    </li>
                  ))}
                  {valid.length > 5 && (
                    <li className="text-muted">… and {valid.length - 5} more</li>
                  )}
                </ul>
              )}
              <Button
                disabled={!valid.length || importRows.isSuccess}
                busy={importRows.isPending}
                onClick={() => importRows.mutate(valid)}
              >
                Import {valid.length} valid {valid.length === 1 ? 'row' : 'rows'}
              </Button>
              {problems.length > 0 && (
                <p className="text-sm text-muted">
                  Rows with problems are left out. Fix them in your file and import those later.
                </p>
              )}
              {importRows.isSuccess && (
                <Notice tone="ok" title={`Imported ${importRows.data.imported} animals.`} />
              )}
              {importRows.isError && <Notice tone="error" title={importRows.error.message} />}
            </section>
          )}
        </>
      )}
    </div>
  );
}
