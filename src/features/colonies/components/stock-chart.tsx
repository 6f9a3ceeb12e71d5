import {
  CartesianGrid,
  Label,
  Legend,
  Line,
  LineChart,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import type { StockPoint } from '#shared/domain/colonies/stock-series';
import { formatLocalDate } from '#shared/domain/date-words';
import { localDateOf } from '#shared/domain/local-dates';

// Sizes told apart by dash pattern as well as colour, so the chart reads in black and white.
const STROKES = [
  { color: 'var(--c-primary)', dash: undefined },
  { color: 'var(--c-text)', dash: '6 4' },
  { color: 'var(--c-accent)', dash: '2 3' },
  { color: 'var(--c-muted)', dash: '10 3 2 3' },
];

/**
 * A colony's estimated count per size over time (recharts, loaded only with this chart, styled
 * like the growth chart). The table beside it on the page is the text alternative.
 */
export default function StockChart({
  points,
  sizes,
  timeZone,
}: {
  points: StockPoint[];
  sizes: string[];
  timeZone: string;
}) {
  const data = points.map((p) => ({ t: new Date(p.at).getTime(), ...p.counts }));
  const day = (t: number) =>
    formatLocalDate(localDateOf(new Date(t), timeZone), undefined, { weekday: false });
  const last = points.at(-1);
  return (
    <figure className="flex flex-col gap-1">
      <div
        role="img"
        aria-label={`Stock over time, ${points.length} changes; now ${sizes.map((s) => `${s} ${last?.counts[s] ?? 0}`).join(', ')}. The table below lists every change.`}
        className="h-64 w-full"
      >
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={data} margin={{ top: 8, right: 16, bottom: 20, left: 28 }}>
            <CartesianGrid stroke="var(--c-border)" strokeDasharray="3 3" />
            <XAxis
              dataKey="t"
              type="number"
              scale="time"
              domain={['dataMin', 'dataMax']}
              stroke="var(--c-muted)"
              tick={{ fontSize: 12, fill: 'var(--c-text)' }}
              tickFormatter={day}
              padding={{ left: 12, right: 12 }}
            >
              <Label value="Date" position="bottom" offset={4} fill="var(--c-text)" />
            </XAxis>
            <YAxis
              stroke="var(--c-muted)"
              tick={{ fontSize: 12, fill: 'var(--c-text)' }}
              width={56}
              allowDecimals={false}
              domain={[0, 'auto']}
            >
              <Label
                value="Estimated count"
                angle={-90}
                position="insideLeft"
                offset={-4}
                style={{ textAnchor: 'middle' }}
                fill="var(--c-text)"
              />
            </YAxis>
            <Tooltip
              labelFormatter={(t) => day(Number(t))}
              contentStyle={{
                background: 'var(--c-surface)',
                border: '2px solid var(--c-border)',
                color: 'var(--c-text)',
              }}
            />
            <Legend verticalAlign="top" wrapperStyle={{ color: 'var(--c-text)' }} />
            {sizes.map((s, i) => (
              <Line
                key={s}
                type="stepAfter"
                dataKey={s}
                name={s}
                stroke={STROKES[i % STROKES.length]!.color}
                strokeDasharray={STROKES[i % STROKES.length]!.dash}
                strokeWidth={3}
                dot={{ r: 4 }}
                connectNulls
                isAnimationActive={false}
              />
            ))}
          </LineChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}
