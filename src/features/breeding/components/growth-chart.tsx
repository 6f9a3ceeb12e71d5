import {
  CartesianGrid,
  Line,
  LineChart,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import type { GrowthPoint } from '#shared/domain/growth';

/** Size after each molt over time (recharts, loaded only with this chart). */
export default function GrowthChart({ points, unit }: { points: GrowthPoint[]; unit: string }) {
  const data = points
    .filter((p) => p.sizeMm !== null)
    .map((p) => ({ date: p.date, size: p.sizeMm }));
  return (
    <div
      role="img"
      aria-label={`Leg span after each molt: ${data.map((d) => `${d.date} ${d.size} ${unit}`).join(', ')}`}
      className="h-56 w-full"
    >
      <ResponsiveContainer width="100%" height="100%">
        <LineChart data={data} margin={{ top: 8, right: 12, bottom: 8, left: 0 }}>
          <CartesianGrid stroke="var(--c-border)" strokeDasharray="3 3" />
          <XAxis dataKey="date" stroke="var(--c-muted)" tick={{ fontSize: 12 }} />
          <YAxis
            stroke="var(--c-muted)"
            tick={{ fontSize: 12 }}
            width={40}
            unit={unit === 'mm' ? '' : ''}
          />
          <Tooltip
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
  );
}
