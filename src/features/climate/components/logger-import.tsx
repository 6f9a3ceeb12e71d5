import { useMemo, useState } from 'react';
import {
  guessLoggerSettings,
  planLoggerImport,
  type LoggerSettings,
} from '#shared/domain/climate/logger-import';
import { readCsv, type CsvTable } from '#shared/domain/csv/csv-file';
import { clockTime, describeLocalDate, localDateOf } from '#shared/domain/local-dates';
import {
  formatHumidity,
  formatTemperature,
  TEMPERATURE_UNITS,
  type TemperatureUnit,
} from '#shared/domain/temperature';
import { MAX_LOGGER_ROWS } from '#shared/schemas/climate';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useImportLogger } from '../api/climate-api';

const MAX_FILE_BYTES = 10 * 1024 * 1024;
const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/**
 * A data logger's CSV in: say which column is the time, the temperature and the humidity,
 * the file's unit and the logger's time zone; see every row that cannot be read (by line)
 * and a preview of the rest in the person's unit and the collection's time; import.
 */
export function LoggerImport({
  collectionId,
  room,
  timeZone,
  unit,
}: {
  collectionId: string;
  room: string;
  timeZone: string;
  unit: TemperatureUnit;
}) {
  const [file, setFile] = useState<{ name: string; table: CsvTable } | null>(null);
  const [settings, setSettings] = useState<LoggerSettings | null>(null);
  const [readError, setReadError] = useState<string | null>(null);
  const importRows = useImportLogger(collectionId);

  const open = async (f: File | undefined) => {
    setReadError(null);
    importRows.reset();
    if (!f) return;
    if (f.size > MAX_FILE_BYTES) return setReadError('That file is over 10 MB. Split it first.');
    const table = readCsv(await f.text());
    if (!table.headers.length || !table.records.length)
      return setReadError('That file has no rows under a header row naming the columns.');
    if (table.records.length > MAX_LOGGER_ROWS)
      return setReadError(
        `That file has ${table.records.length} rows; import at most ${MAX_LOGGER_ROWS} at a time.`,
      );
    setFile({ name: f.name, table });
    setSettings({ ...guessLoggerSettings(table.headers), zone: timeZone });
  };
  const plan = useMemo(
    () => (file && settings ? planLoggerImport(file.table, settings) : null),
    [file, settings],
  );
  const change = (patch: Partial<LoggerSettings>) => {
    importRows.reset();
    setSettings((s) => (s ? { ...s, ...patch } : s));
  };
  const columns = [
    { value: '', label: 'Not in this file' },
    ...(file?.table.headers.map((h, i) => ({ value: String(i), label: h || `Column ${i + 1}` })) ??
      []),
  ];
  const column = (key: 'time' | 'temperature' | 'humidity', label: string) => (
    <SelectField
      label={label}
      options={columns}
      value={settings?.[key] === null ? '' : String(settings?.[key])}
      onChange={(e) => change({ [key]: e.target.value === '' ? null : Number(e.target.value) })}
    />
  );
  const when = (iso: string) =>
    `${describeLocalDate(localDateOf(new Date(iso), timeZone))}, ${clockTime(iso, timeZone)}`;

  return (
    <div className="flex flex-col gap-3">
      <label className="flex min-h-target cursor-pointer items-center justify-center rounded-xl border-2 border-border bg-surface px-4 text-center text-lg font-bold has-[:focus-visible]:outline has-[:focus-visible]:outline-4">
        {file ? `Chosen: ${file.name} · choose another` : 'Choose the logger’s CSV file'}
        <input
          type="file"
          accept=".csv,text/csv,text/plain"
          className="sr-only"
          onChange={(e) => void open(e.target.files?.[0])}
        />
      </label>
      {readError && <Notice tone="error" title={readError} />}
      {file && settings && plan && (
        <>
          {column('time', 'Date and time column')}
          {column('temperature', 'Temperature column')}
          {column('humidity', 'Humidity column')}
          <SelectField
            label="The file’s temperatures are in"
            options={TEMPERATURE_UNITS.map((u) => ({
              value: u,
              label: u === 'C' ? 'Celsius (°C)' : 'Fahrenheit (°F)',
            }))}
            value={settings.unit}
            onChange={(e) => change({ unit: e.target.value as TemperatureUnit })}
          />
          <TextField
            label="The logger’s time zone"
            hint="As the logger’s clock was set, e.g. Europe/Amsterdam. An hour repeated when the clocks go back is read in the order of the rows; a time in the hour skipped in spring is refused."
            value={settings.zone}
            onChange={(e) => change({ zone: e.target.value })}
          />
          <Notice
            tone={plan.problems.length ? 'warning' : 'ok'}
            title={`${plural(plan.rows.length, 'row', 'rows')} ready${plan.problems.length ? `, ${plural(plan.problems.length, 'row', 'rows')} cannot be read` : ''}`}
          >
            {plan.problems.length > 0 && (
              <ul aria-label="Rows that cannot be read" className="max-h-60 overflow-y-auto">
                {plan.problems.map((p) => (
                  <li key={`${p.line}-${p.message}`}>
                    Line {p.line}: {p.message}
                  </li>
                ))}
              </ul>
            )}
          </Notice>
          {plan.rows.length > 0 && (
            <table className="w-full text-left">
              <caption className="text-left font-bold">First rows, in your unit and time</caption>
              <thead>
                <tr>
                  <th scope="col">Line</th>
                  <th scope="col">When</th>
                  <th scope="col">Temp.</th>
                  <th scope="col">RH</th>
                </tr>
              </thead>
              <tbody>
                {plan.rows.slice(0, 5).map((r) => (
                  <tr key={r.line} className="border-t border-border">
                    <td>{r.line}</td>
                    <td>{when(r.takenAt)}</td>
                    <td>{formatTemperature(r.celsius, unit)}</td>
                    <td>{formatHumidity(r.humidity)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
          <Button
            wide
            disabled={!plan.rows.length}
            busy={importRows.isPending}
            onClick={() =>
              importRows.mutate({
                room,
                rows: plan.rows.map(({ takenAt, celsius, humidity }) => ({
                  takenAt,
                  celsius,
                  humidity,
                })),
              })
            }
          >
            Import {plural(plan.rows.length, 'reading', 'readings')} into {room}
          </Button>
          {importRows.isSuccess && (
            <Notice
              tone="ok"
              title={`${plural(importRows.data.added, 'reading', 'readings')} added${importRows.data.alreadyThere ? `, ${importRows.data.alreadyThere} already there` : ''}.`}
            />
          )}
          {importRows.isError && <Notice tone="error" title={importRows.error.message} />}
        </>
      )}
    </div>
  );
}
