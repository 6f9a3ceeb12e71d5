import { useId, type TextareaHTMLAttributes } from 'react';

interface Props extends TextareaHTMLAttributes<HTMLTextAreaElement> {
  label: string;
  /** The label's look: a form's only field may carry its heading. */
  labelClassName?: string;
  hint?: string;
  error?: string;
}

/** A text field for a few lines (notes), labelled and with its message like `TextField`. */
export function TextAreaField({
  label,
  labelClassName = 'font-bold',
  hint,
  error,
  className = '',
  ...rest
}: Props) {
  const id = useId();
  const described = [hint ? `${id}-hint` : null, error ? `${id}-error` : null]
    .filter(Boolean)
    .join(' ');
  return (
    <div className={`flex flex-col gap-2 ${className}`}>
      <label htmlFor={id} className={labelClassName}>
        {label}
      </label>
      {hint && (
        <p id={`${id}-hint`} className="text-sm text-muted">
          {hint}
        </p>
      )}
      <textarea
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={described || undefined}
        className="rounded-xl border-2 border-border bg-surface p-2 text-lg text-text aria-[invalid]:border-danger"
        {...rest}
      />
      {error && (
        <p id={`${id}-error`} className="flex items-center gap-1 text-sm font-bold text-danger">
          <span aria-hidden="true">⚠</span> {error}
        </p>
      )}
    </div>
  );
}
