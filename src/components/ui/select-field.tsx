import { useId, type SelectHTMLAttributes } from 'react';

interface Props extends SelectHTMLAttributes<HTMLSelectElement> {
  label: string;
  options: readonly { value: string; label: string }[];
  error?: string;
  /** A line under the label, read out with the field (an example, what the choice does). */
  hint?: string;
}

export function SelectField({ label, options, error, hint, className = '', ...rest }: Props) {
  const id = useId();
  const described = [hint ? `${id}-hint` : null, error ? `${id}-error` : null]
    .filter(Boolean)
    .join(' ');
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="font-bold">
        {label}
      </label>
      {hint && (
        <p id={`${id}-hint`} className="text-sm text-muted">
          {hint}
        </p>
      )}
      <select
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={described || undefined}
        className="min-h-target rounded-xl border-2 border-border bg-surface px-3 text-lg text-text aria-[invalid]:border-danger"
        {...rest}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      {error && (
        <p id={`${id}-error`} className="flex items-center gap-1 text-sm font-bold text-danger">
          <span aria-hidden="true">⚠</span> {error}
        </p>
      )}
    </div>
  );
}
