import type { ReactNode } from 'react';
import { cx } from './cx';

type Tone = 'info' | 'success' | 'error' | 'warning';

const TONES: Record<Tone, string> = {
  info: 'border-brand-300 bg-brand-50 text-brand-900',
  success: 'border-success-700/40 bg-success-50 text-success-700',
  error: 'border-danger-700/40 bg-danger-50 text-danger-800',
  warning: 'border-accent-400 bg-accent-100 text-ink',
};

/** Errors interrupt (role=alert); everything else is announced politely (role=status). */
export function Alert({ tone = 'info', title, children, className }: { tone?: Tone; title?: string; children?: ReactNode; className?: string }) {
  return (
    <div role={tone === 'error' ? 'alert' : 'status'} className={cx('rounded-lg border px-4 py-3', TONES[tone], className)}>
      {title ? <p className="font-bold">{title}</p> : null}
      {children ? <div className={title ? 'mt-1' : undefined}>{children}</div> : null}
    </div>
  );
}
