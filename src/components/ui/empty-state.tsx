import type { ReactNode } from 'react';
import { cx } from './cx';

export function EmptyState({ title, children, action, className }: { title: string; children?: ReactNode; action?: ReactNode; className?: string }) {
  return (
    <div className={cx('rounded-2xl border border-dashed border-line-strong bg-canvas-raised/60 px-6 py-10 text-center', className)}>
      <svg viewBox="0 0 48 48" className="mx-auto size-12 text-brand-700" aria-hidden="true">
        <ellipse cx="24" cy="30" rx="16" ry="6" fill="none" stroke="currentColor" strokeWidth="2.5" />
        <path d="M8 30v-6c0-3.3 7.2-6 16-6s16 2.7 16 6v6" fill="none" stroke="currentColor" strokeWidth="2.5" />
        <path d="M14 8l8 10M34 8l-8 10" stroke="currentColor" strokeWidth="2.5" strokeLinecap="round" />
      </svg>
      <p className="mt-3 text-lg font-bold">{title}</p>
      {children ? <div className="mx-auto mt-2 max-w-md text-ink-muted">{children}</div> : null}
      {action ? <div className="mt-5 flex justify-center gap-3">{action}</div> : null}
    </div>
  );
}
