/** Kitlane's own mark: a drum shell seen from above with two sticks, next to the name. */
export function Wordmark() {
  return (
    <span className="inline-flex items-center gap-2">
      <svg viewBox="0 0 32 32" className="size-8" aria-hidden="true">
        <rect width="32" height="32" rx="8" className="fill-canvas-raised" />
        <circle cx="16" cy="18" r="8" fill="none" strokeWidth="3" className="stroke-brand-700" />
        <circle cx="16" cy="18" r="2.5" className="fill-accent-400" />
        <path d="M6 8l8 6M26 8l-8 6" strokeWidth="2.5" strokeLinecap="round" className="stroke-ink" />
      </svg>
      <span className="text-xl font-bold tracking-tight">Kitlane</span>
    </span>
  );
}
