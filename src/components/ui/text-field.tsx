import { forwardRef, useId, type InputHTMLAttributes, type ReactNode } from 'react';

interface TextFieldProps extends InputHTMLAttributes<HTMLInputElement> {
  label: string;
  error?: string;
  hint?: string;
  /** Shown at the end of the input's row, e.g. a show-password button. */
  trailing?: (inputId: string) => ReactNode;
}

export const TextField = forwardRef<HTMLInputElement, TextFieldProps>(function TextField(
  { label, error, hint, id, className = '', trailing, ...rest },
  ref,
) {
  const auto = useId();
  const inputId = id ?? auto;
  const described = [hint ? `${inputId}-hint` : null, error ? `${inputId}-error` : null]
    .filter(Boolean)
    .join(' ');
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={inputId} className="font-bold">
        {label}
      </label>
      {hint && (
        <p id={`${inputId}-hint`} className="text-sm text-muted">
          {hint}
        </p>
      )}
      <div className="flex items-stretch gap-2">
        <input
          ref={ref}
          id={inputId}
          aria-invalid={error ? true : undefined}
          aria-describedby={described || undefined}
          className="min-h-target min-w-0 flex-1 rounded-xl border-2 border-border bg-surface px-3 text-lg text-text placeholder:text-muted aria-[invalid]:border-danger"
          {...rest}
        />
        {trailing?.(inputId)}
      </div>
      {error && (
        <p
          id={`${inputId}-error`}
          className="flex items-center gap-1 text-sm font-bold text-danger"
        >
          <span aria-hidden="true">⚠</span> {error}
        </p>
      )}
    </div>
  );
});
