export function ProgressBar({ done, total }: { done: number; total: number }) {
  const pct = total ? Math.round((done / total) * 100) : 100;
  return (
    <div className="flex flex-col gap-1">
      <p className="flex justify-between font-bold">
        <span>
          {done} of {total} tasks done
        </span>
        <span>{pct}%</span>
      </p>
      <div
        role="progressbar"
        aria-label="Round progress"
        aria-valuemin={0}
        aria-valuemax={total}
        aria-valuenow={done}
        className="h-4 overflow-hidden rounded-full border-2 border-border bg-bg"
      >
        <div className="h-full bg-primary" style={{ width: `${pct}%` }} />
      </div>
    </div>
  );
}
