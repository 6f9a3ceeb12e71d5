import type { ReactNode } from 'react';

type Tone = 'info' | 'error' | 'ok' | 'warning';

const TONES: Record<Tone, { className: string; symbol: string; word: string }> = {
  info: { className: 'border-border text-text', symbol: 'ℹ', word: 'Note' },
  error: { className: 'border-danger text-danger', symbol: '⚠', word: 'Problem' },
  warning: { className: 'border-accent text-accent', symbol: '!', word: 'Attention' },
  ok: { className: 'border-ok text-ok', symbol: '✓', word: 'Done' },
};

/** A message box whose tone is told by symbol and word as well as colour. */
export function Notice({
  tone = 'info',
  title,
  children,
}: {
  tone?: Tone;
  title?: string;
  children?: ReactNode;
}) {
  const t = TONES[tone];
  return (
    <div
      role={tone === 'error' ? 'alert' : 'status'}
      className={`rounded-xl border-2 bg-surface p-3 ${t.className}`}
    >
      <p className="flex items-start gap-2 font-bold">
        <span aria-hidden="true" className="text-xl leading-6">
          {t.symbol}
        </span>
        <span>
          <span className="sr-only">{t.word}: </span>
          {title}
        </span>
      </p>
      {children && <div className="mt-1 text-text">{children}</div>}
    </div>
  );
}
