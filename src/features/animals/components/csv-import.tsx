import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import {
  ANIMAL_GROUPS,
  GROUP_LABEL,
  LIFE_STAGES,
  SEX_LABEL,
  SEXES,
  STAGE_LABEL,
  stageLabel,
  type AnimalGroup,
  type LifeStage,
  type Sex,
} from '#shared/domain/animal-facts';
import {
  COLUMN_LABEL,
  IMPORT_COLUMNS,
  REQUIRED_COLUMNS,
  type AnimalColumn,
} from '#shared/domain/csv/animal-columns';
import { readCsv, type CsvTable } from '#shared/domain/csv/csv-file';
import {
  DATE_ORDERS,
  numericDate,
  SIZE_INPUT_UNITS,
  SIZE_UNIT_LABEL,
  type DateOrder,
} from '#shared/domain/import/cell-readers';
import {
  firstSettings,
  planImport,
  questionsFor,
  settledDateOrder,
  sizeUnitFor,
  type ImportSettings,
} from '#shared/domain/import/plan-import';
import type { LocalDate } from '#shared/domain/local-dates';
import { placeName } from '#shared/domain/places';
import { formatSize, type SizeUnit } from '#shared/domain/units';
import { MAX_IMPORT_ROWS } from '#shared/schemas/import';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { useImportAnimals } from '../api/animal-records';

const MAX_FILE_BYTES = 10 * 1024 * 1024;
const SKIP = '';
const PREVIEW_ROWS = 5;

interface Props {
  collectionId: string;
  /** Codes the collection already uses: a row repeating one is reported, not sent. */
  takenCodes: readonly string[];
  /** The person's unit for sizes: bare numbers are read in it unless the header names one. */
  sizeUnit: SizeUnit;
}

/** A date in the person's own words and order, with the month named so it cannot be misread. */
const longDate = new Intl.DateTimeFormat(undefined, { dateStyle: 'long', timeZone: 'UTC' });
const sayDate = (date: LocalDate) => longDate.format(new Date(`${date}T00:00:00Z`));

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/**
 * A spreadsheet in: say where its columns go, answer what the file leaves open (a stage for
 * every row, the date order), see how many rows are ready and why the others are not, import.
 */
export function CsvImport({ collectionId, takenCodes, sizeUnit }: Props) {
  const [file, setFile] = useState<{ name: string; table: CsvTable } | null>(null);
  const [settings, setSettings] = useState<ImportSettings | null>(null);
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
    if (!table.records.length)
      return setReadError('That file has a header row but no animals under it.');
    if (table.records.length > MAX_IMPORT_ROWS)
      return setReadError(
        `That file has ${table.records.length} rows; import at most ${MAX_IMPORT_ROWS} at a time.`,
      );
    setFile({ name: f.name, table });
    setSettings(firstSettings(table, sizeUnit));
  };

  const questions = useMemo(
    () => (file && settings ? questionsFor(file.table, settings.mapping) : null),
    [file, settings],
  );
  const plan = useMemo(
    () => (file && settings ? planImport(file.table, settings, takenCodes) : null),
    [file, settings, takenCodes],
  );

  const change = (patch: Partial<ImportSettings>) => {
    importRows.reset();
    setSettings((s) => (s ? { ...s, ...patch } : s));
  };
  const changeDefault = (patch: Partial<ImportSettings['defaults']>) =>
    settings && change({ defaults: { ...settings.defaults, ...patch } });
  const mapColumn = (index: number, column: AnimalColumn | null) => {
    if (!file || !settings) return;
    const mapping = settings.mapping.map((c, j) => (j === index ? column : c));
    // A header that names a unit ("Size (in)") says how to read that column's bare numbers.
    const unit = column === 'size_mm' ? sizeUnitFor(file.table, mapping) : null;
    change({ mapping, ...(unit ? { sizeUnit: unit } : {}) });
  };

  const firstRow = file?.table.records[0]?.cells ?? [];
  const columnsReady = questions && !questions.missing.length && !questions.doubled.length;
  const dates = questions?.dates;
  const settled = dates ? settledDateOrder(dates) : null;
  const settledBy = settled ? dates?.only[settled] : null;

  return (
    <div className="flex flex-col gap-6">
      <label className="flex min-h-target cursor-pointer items-center justify-center rounded-xl border-2 border-border bg-surface px-4 text-center text-lg font-bold has-[:focus-visible]:outline has-[:focus-visible]:outline-4">
        {file ? `Chosen: ${file.name} · choose another` : 'Choose a CSV file'}
        <input
          type="file"
          accept=".csv,text/csv"
          className="sr-only"
          onChange={(e) => void open(e.target.files?.[0])}
        />
      </label>
      {readError && <Notice tone="error" title={readError} />}
      {file && settings && questions && (
        <>
          <section aria-labelledby="map-heading" className="flex flex-col gap-3">
            <h2 id="map-heading" className="text-xl font-extrabold">
              1. Your columns
            </h2>
            <p className="text-muted">
              Say what each column of your file holds. Needed:{' '}
              {REQUIRED_COLUMNS.map((c) => COLUMN_LABEL[c]).join(' and ')}. Anything else can be
              left out.
            </p>
            <div className="grid gap-3 md:grid-cols-2">
              {file.table.headers.map((h, i) => (
                <SelectField
                  key={`${h}-${i}`}
                  label={`Your “${h || `column ${i + 1}`}”`}
                  hint={firstRow[i]?.trim() ? `First row: ${firstRow[i]!.trim()}` : undefined}
                  value={settings.mapping[i] ?? SKIP}
                  onChange={(e) => mapColumn(i, (e.target.value as AnimalColumn) || null)}
                  options={[
                    { value: SKIP, label: 'Leave out' },
                    ...IMPORT_COLUMNS.map((c) => ({ value: c, label: COLUMN_LABEL[c] })),
                  ]}
                />
              ))}
            </div>
            {questions.missing.length > 0 && (
              <Notice
                tone="warning"
                title={`Choose a column for ${questions.missing.map((c) => COLUMN_LABEL[c]).join(' and ')}.`}
              />
            )}
            {questions.doubled.map((c) => (
              <Notice
                key={c}
                tone="warning"
                title={`Two of your columns go to ${COLUMN_LABEL[c]}: leave one out.`}
              />
            ))}
          </section>

          {columnsReady && (
            <section aria-labelledby="whole-heading" className="flex flex-col gap-4">
              <h2 id="whole-heading" className="text-xl font-extrabold">
                2. For the whole file
              </h2>
              {questions.withoutStage > 0 && (
                <SelectField
                  label="Life stage"
                  hint={
                    questions.withoutStage === file.table.records.length
                      ? 'Your file has no life stage: choose one for every row. You can change each animal later.'
                      : `${plural(questions.withoutStage, 'row gives', 'rows give')} no life stage: choose one for them.`
                  }
                  value={settings.defaults.stage ?? SKIP}
                  onChange={(e) => changeDefault({ stage: (e.target.value as LifeStage) || null })}
                  options={[
                    { value: SKIP, label: 'Choose a life stage' },
                    ...LIFE_STAGES.map((s) => ({ value: s, label: STAGE_LABEL[s] })),
                  ]}
                />
              )}
              {questions.withoutGroup > 0 && (
                <SelectField
                  label="Group"
                  hint={`${plural(questions.withoutGroup, 'row gives', 'rows give')} no group and a genus we don’t know: choose one for them.`}
                  value={settings.defaults.group ?? SKIP}
                  onChange={(e) =>
                    changeDefault({ group: (e.target.value as AnimalGroup) || null })
                  }
                  options={[
                    { value: SKIP, label: 'Choose a group' },
                    ...ANIMAL_GROUPS.map((g) => ({ value: g, label: GROUP_LABEL[g] })),
                  ]}
                />
              )}
              {questions.withoutSex > 0 && (
                <SelectField
                  label="Sex"
                  hint={`For the ${plural(questions.withoutSex, 'row', 'rows')} with no sex written.`}
                  value={settings.defaults.sex}
                  onChange={(e) => changeDefault({ sex: e.target.value as Sex })}
                  options={SEXES.map((s) => ({ value: s, label: SEX_LABEL[s] }))}
                />
              )}
              {questions.bareSizes > 0 && (
                <ChoiceGroup
                  legend={`Sizes with no unit written (${plural(questions.bareSizes, 'row', 'rows')}) are in`}
                  className="grid-cols-3"
                  value={settings.sizeUnit}
                  options={SIZE_INPUT_UNITS}
                  onChange={(sizeUnit) => change({ sizeUnit })}
                  render={(u) => SIZE_UNIT_LABEL[u]}
                />
              )}
              {dates?.ambiguous && (
                <div className="flex flex-col gap-1">
                  <ChoiceGroup<DateOrder | ''>
                    legend={`Dates such as ${dates.ambiguous.cell} (line ${dates.ambiguous.line}) are written`}
                    className="grid-cols-2"
                    value={settings.dateOrder ?? ''}
                    options={DATE_ORDERS}
                    onChange={(order) => change({ dateOrder: order || null })}
                    render={(order) => (
                      <>
                        <span>{order === 'day-first' ? 'Day first' : 'Month first'}</span>
                        <span className="font-normal">
                          {sayDate(dates.ambiguous!.readings[order as DateOrder])}
                        </span>
                      </>
                    )}
                  />
                  <p className="text-sm text-muted">
                    {settledBy
                      ? `Line ${settledBy.line} has ${settledBy.cell}, which can only be ${settled === 'day-first' ? 'day' : 'month'} first.`
                      : 'Nothing else in the file tells which, so please choose. It is used for every date written this way; dates such as 2025-04-03 need no choice.'}
                  </p>
                </div>
              )}
              {questions.withoutStage +
                questions.withoutGroup +
                questions.withoutSex +
                questions.bareSizes ===
                0 &&
                !dates?.ambiguous && (
                  <p className="text-muted">Nothing to choose: every row says all we need.</p>
                )}
            </section>
          )}

          {columnsReady && plan && (
            <section aria-labelledby="check-heading" className="flex flex-col gap-3">
              <h2 id="check-heading" className="text-xl font-extrabold">
                3. Check and import
              </h2>
              <p aria-live="polite" className="text-lg font-bold">
                {plan.ready.length} of {plural(plan.rows.length, 'row', 'rows')} ready;{' '}
                {plan.problems.length} {plan.problems.length === 1 ? 'needs' : 'need'} attention.
              </p>
              {plan.problems.length > 0 && (
                <ul
                  aria-label="Rows that need attention"
                  className="flex flex-col gap-2 rounded-xl border-2 border-danger p-3"
                >
                  {plan.problems.map((p) => (
                    <li key={p.line}>
                      <p className="font-bold">
                        Line {p.line}
                        {p.name && ` · ${p.name}`}
                      </p>
                      <ul className="list-disc pl-5">
                        {p.result.errors.map((e) => (
                          <li key={e}>{e}</li>
                        ))}
                      </ul>
                    </li>
                  ))}
                </ul>
              )}
              {plan.ready.length > 0 && (
                <div className="flex flex-col gap-1">
                  <h3 className="font-bold">
                    {plan.ready.length > PREVIEW_ROWS
                      ? `The first ${PREVIEW_ROWS} as they will be saved`
                      : 'As they will be saved'}
                  </h3>
                  <ul aria-label="Rows ready to import" className="flex flex-col gap-2">
                    {plan.readyRows
                      .slice(0, PREVIEW_ROWS)
                      .map(({ line, cells, result: { value: v } }) => {
                        const size = v.sizeMm === null ? null : formatSize(v.sizeMm, sizeUnit);
                        const acquired = v.acquiredOn && sayDate(v.acquiredOn);
                        // What the keeper wrote, beside a size converted or a date read in the chosen order.
                        const asWritten = (shown: string, cell = '') =>
                          cell.trim() &&
                          shown !== cell.trim() &&
                          !shown.startsWith(`${cell.trim()} `)
                            ? ` (${cell.trim()})`
                            : '';
                        return (
                          <li
                            key={line}
                            className="rounded-xl border-2 border-border bg-surface p-2"
                          >
                            <span className="font-bold">{v.name}</span> ·{' '}
                            <i lang="la">{v.scientificName}</i>
                            <br />
                            {GROUP_LABEL[v.group]}, {stageLabel(v.group, v.lifeStage).toLowerCase()}
                            {' · '}
                            {SEX_LABEL[v.sex]}
                            {size && ` · ${size}${asWritten(size, cells.size_mm)}`}
                            {acquired &&
                              ` · acquired ${acquired}${numericDate(cells.acquired_on ?? '') ? asWritten(acquired, cells.acquired_on) : ''}`}
                            {v.place && ` · ${placeName(v.place)}`}
                          </li>
                        );
                      })}
                  </ul>
                  {plan.ready.length > PREVIEW_ROWS && (
                    <p className="text-muted">… and {plan.ready.length - PREVIEW_ROWS} more.</p>
                  )}
                </div>
              )}
              <Button
                disabled={!plan.ready.length || importRows.isSuccess}
                busy={importRows.isPending}
                onClick={() => importRows.mutate(plan.ready)}
              >
                {plan.ready.length
                  ? `Import ${plural(plan.ready.length, 'row', 'rows')}`
                  : 'No rows ready yet'}
              </Button>
              {plan.problems.length > 0 && plan.ready.length > 0 && (
                <p className="text-sm text-muted">
                  Rows that need attention are left out: fix them above or in your file, or import
                  them later.
                </p>
              )}
              {importRows.isSuccess && (
                <Notice
                  tone="ok"
                  title={`Imported ${plural(importRows.data.imported, 'animal', 'animals')}.`}
                >
                  <Link to="/animals" className="font-bold underline underline-offset-4">
                    See them in Animals
                  </Link>
                </Notice>
              )}
              {importRows.isError && <Notice tone="error" title={importRows.error.message} />}
            </section>
          )}
        </>
      )}
    </div>
  );
}
