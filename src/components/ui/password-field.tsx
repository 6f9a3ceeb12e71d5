import { forwardRef, useState, type ComponentProps } from 'react';
import { TextField } from './text-field';

/**
 * A password field with a Show/Hide button (OWASP ASVS 4.0.3 2.1.12): typing a long password
 * with gloves on is easier when you can check it.
 */
export const PasswordField = forwardRef<
  HTMLInputElement,
  Omit<ComponentProps<typeof TextField>, 'type' | 'trailing'>
>(function PasswordField(props, ref) {
  const [shown, setShown] = useState(false);
  return (
    <TextField
      ref={ref}
      {...props}
      type={shown ? 'text' : 'password'}
      trailing={(inputId) => (
        <button
          type="button"
          aria-pressed={shown}
          aria-controls={inputId}
          onClick={() => setShown((s) => !s)}
          className="min-h-target min-w-target rounded-xl border-2 border-border bg-surface px-3 font-bold text-text"
        >
          {shown ? 'Hide' : 'Show'}
          <span className="sr-only"> password</span>
        </button>
      )}
    />
  );
});
