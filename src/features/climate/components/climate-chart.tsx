import {
  CartesianGrid,
  Label,
  Line,
  LineChart,
  ReferenceArea,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import type { RoomTargets } from '#shared/domain/climate/ranges';
import { formatLocalDate } from '#shared/domain/date-words';
import {
  TEMPERATURE_SYMBOL,
  temperatureInUnit,
  type TemperatureUnit,
} from '#shared/domain/temperature';
import type { DaySummaryView } from '#shared/schemas/climate';

const axisDate = (date: string) => formatLocalDate(date, undefined, { weekday: false });

/**
 * A room's days as two lines, the day's lowest and highest, with the target range drawn in as
 * a band (recharts, as the growth chart; loaded only with this screen). The table beside it
 * says the same in words.
 */
export default function ClimateChart({
  days,
  targets,
  unit,
  measure,
}: {
  days: DaySummaryView[];
  targets: RoomTargets;
  unit: TemperatureUnit;
  measure: 'temperature' | 'humidity';
}) {
  const temperature = measure === 'temperature';
  const symbol = temperature ? TEMPERATURE_SYMBOL[unit] : '%';
  const convert = (v: number | null) =>
    v === null ? null : temperature ? temperatureInUnit(v, unit) : v;
  const data = days.map((d) => ({
    date: d.date,
    low: convert(temperature ? d.lowCelsius : d.lowHumidity),
    high: convert(temperature ? d.highCelsius : d.highHumidity),
  }));
  const bandLow = convert(temperature ? targets.minCelsius : targets.minHumidity);
  const bandHigh = convert(temperature ? targets.maxCelsius : targets.maxHumidity);
  const title = temperature ? `Temperature (${symbol})` : 'Relative humidity (%)';
  return (
    <figure className="flex flex-col gap-1">
      <figcaption className="font-bold">
        {title}: lowest and highest of each day
        {bandLow !== null || bandHigh !== null ? ', the target range shaded' : ''}
        <span className="block text-sm font-normal">
          Solid line: the day’s lowest · dashed line: the day’s highest
        </span>
      </figcaption>
      <div
        role="img"
        aria-label={`${title} per day, as in the table below`}
        className="h-60 w-full"
      >
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={data} margin={{ top: 8, right: 16, bottom: 20, left: 8 }}>
            <CartesianGrid stroke="var(--c-border)" strokeDasharray="3 3" />
            {(bandLow !== null || bandHigh !== null) && (
              <ReferenceArea
                y1={bandLow ?? undefined}
                y2={bandHigh ?? undefined}
                fill="var(--c-ok)"
                fillOpacity={0.18}
                stroke="var(--c-ok)"
                strokeDasharray="4 4"
                ifOverflow="extendDomain"
              />
            )}
            <XAxis
              dataKey="date"
              stroke="var(--c-muted)"
              tick={{ fontSize: 12, fill: 'var(--c-text)' }}
              tickFormatter={axisDate}
              padding={{ left: 12, right: 12 }}
            >
              <Label value="Day" position="bottom" offset={4} fill="var(--c-text)" />
            </XAxis>
            <YAxis
              stroke="var(--c-muted)"
              tick={{ fontSize: 12, fill: 'var(--c-text)' }}
              width={48}
              domain={['auto', 'auto']}
            />
            <Tooltip
              labelFormatter={(d) => formatLocalDate(String(d))}
              formatter={(v, name) => [
                `${String(v)} ${symbol}`,
                name === 'low' ? 'Lowest' : 'Highest',
              ]}
              contentStyle={{
                background: 'var(--c-surface)',
                border: '2px solid var(--c-border)',
                color: 'var(--c-text)',
              }}
            />
            <Line
              type="monotone"
              dataKey="low"
              stroke="var(--c-primary)"
              strokeWidth={3}
              dot={{ r: 4 }}
              isAnimationActive={false}
            />
            <Line
              type="monotone"
              dataKey="high"
              stroke="var(--c-danger)"
              strokeWidth={3}
              strokeDasharray="6 3"
              dot={{ r: 4 }}
              isAnimationActive={false}
            />
          </LineChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}
