import { cx } from './cx';

/** The spinning ring alone, hidden from assistive tech (the caller says what is loading). */
export function SpinnerIcon({ className }: { className?: string }) {
  return (
    <svg className={cx('size-5 animate-spin', className)} viewBox="0 0 24 24" aria-hidden="true">
      <circle cx="12" cy="12" r="9" fill="none" stroke="currentColor" strokeOpacity="0.25" strokeWidth="3" />
      <path d="M21 12a9 9 0 0 0-9-9" fill="none" stroke="currentColor" strokeWidth="3" strokeLinecap="round" />
    </svg>
  );
}

export function Spinner({ label = 'Loading', className }: { label?: string; className?: string }) {
  return (
    <span role="status" className={cx('inline-flex items-center gap-2 text-brand-700', className)}>
      <SpinnerIcon />
      <span className="sr-only">{label}</span>
    </span>
  );
}

/** Whole-page loading state, used while a route's code or data is on its way. */
export function PageSpinner({ label = 'Loading the page' }: { label?: string }) {
  return (
    <div className="flex min-h-[40vh] items-center justify-center">
      <Spinner label={label} className="[&_svg]:size-8" />
    </div>
  );
}
