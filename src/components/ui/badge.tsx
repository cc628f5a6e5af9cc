import type { ReactNode } from 'react';
import { cx } from './cx';

type Tone = 'neutral' | 'brand' | 'accent' | 'success' | 'danger';

const TONES: Record<Tone, string> = {
  neutral: 'bg-canvas-sunken text-ink',
  brand: 'bg-brand-100 text-brand-900',
  accent: 'bg-accent-100 text-ink',
  success: 'bg-success-50 text-success-700',
  danger: 'bg-danger-50 text-danger-800',
};

export function Badge({ tone = 'neutral', children, className }: { tone?: Tone; children: ReactNode; className?: string }) {
  return <span className={cx('inline-flex items-center rounded-full px-2.5 py-0.5 text-sm font-medium', TONES[tone], className)}>{children}</span>;
}
