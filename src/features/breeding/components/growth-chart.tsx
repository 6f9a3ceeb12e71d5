import {
  CartesianGrid,
  Label,
  Line,
  LineChart,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import { formatLocalDate } from '#shared/domain/date-words';
import type { GrowthPoint } from '#shared/domain/growth';

const axisDate = (date: string) => formatLocalDate(date, undefined, { weekday: false });

/**
 * Size after each molt over time (recharts, loaded only with this chart). Both axes say what
 * they measure; a single measurement gets a sentence, as one dot alone reads as a fault.
 */
export default function GrowthChart({
  points,
  unit,
  measure,
}: {
  points: GrowthPoint[];
  unit: string;
  /** "Leg span" or "Body length", after the animal's group. */
  measure: string;
}) {
  const data = points
    .filter((p) => p.sizeMm !== null)
    .map((p) => ({ date: p.date, size: p.sizeMm }));
  const only = data.length === 1 ? data[0]! : null;
  return (
    <figure className="flex flex-col gap-1">
      <div
        role="img"
        aria-label={`${measure} after each molt: ${data.map((d) => `${formatLocalDate(d.date)} ${d.size} ${unit}`).join(', ')}`}
        className="h-60 w-full"
      >
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={data} margin={{ top: 8, right: 16, bottom: 20, left: 8 }}>
            <CartesianGrid stroke="var(--c-border)" strokeDasharray="3 3" />
            <XAxis
              dataKey="date"
              stroke="var(--c-muted)"
              tick={{ fontSize: 12, fill: 'var(--c-text)' }}
              tickFormatter={axisDate}
              padding={only ? { left: 40, right: 40 } : { left: 12, right: 12 }}
            >
              <Label value="Date of the molt" position="bottom" offset={4} fill="var(--c-text)" />
            </XAxis>
            <YAxis
              stroke="var(--c-muted)"
              tick={{ fontSize: 12, fill: 'var(--c-text)' }}
              width={56}
              domain={only ? [0, 'auto'] : ['auto', 'auto']}
            >
              <Label
                value={`${measure} (${unit})`}
                angle={-90}
                position="insideLeft"
                style={{ textAnchor: 'middle' }}
                fill="var(--c-text)"
              />
            </YAxis>
            <Tooltip
              labelFormatter={(d) => formatLocalDate(String(d))}
              formatter={(v) => [`${String(v)} ${unit}`, measure]}
              contentStyle={{
                background: 'var(--c-surface)',
                border: '2px solid var(--c-border)',
                color: 'var(--c-text)',
              }}
            />
            <Line
              type="monotone"
              dataKey="size"
              stroke="var(--c-primary)"
              strokeWidth={3}
              dot={{ r: 5 }}
              isAnimationActive={false}
            />
          </LineChart>
        </ResponsiveContainer>
      </div>
      {only && (
        <figcaption className="text-sm text-muted">
          One measurement so far: {only.size} {unit} after the molt of {formatLocalDate(only.date)}.
          The line starts with the next molt recorded with a size.
        </figcaption>
      )}
    </figure>
  );
}
