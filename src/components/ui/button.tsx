import type { ButtonHTMLAttributes, ReactNode } from 'react';

type Variant = 'primary' | 'secondary' | 'danger' | 'quiet';

const VARIANTS: Record<Variant, string> = {
  primary: 'bg-primary text-on-primary border-primary',
  secondary: 'bg-surface text-text border-border',
  danger: 'bg-surface text-danger border-danger',
  quiet: 'bg-transparent text-text border-transparent underline underline-offset-4',
};

interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: Variant;
  busy?: boolean;
  icon?: ReactNode;
  wide?: boolean;
}

/** At least 48 × 48 px, as the design language asks for gloved thumbs. */
export function Button({
  variant = 'primary',
  busy,
  icon,
  wide,
  className = '',
  children,
  disabled,
  ...rest
}: ButtonProps) {
  return (
    <button
      type="button"
      {...rest}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      className={`inline-flex min-h-target min-w-target items-center justify-center gap-2 rounded-xl border-2 px-4 py-2 text-lg font-bold disabled:opacity-60 ${VARIANTS[variant]} ${wide ? 'w-full' : ''} ${className}`}
    >
      {icon}
      {busy ? <span>Working…</span> : children}
    </button>
  );
}
