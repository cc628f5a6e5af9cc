/** Kitlane's own mark: a snare drum from the side with two crossed sticks, next to the name. */
export function Wordmark() {
  return (
    <span className="inline-flex items-center gap-2">
      <svg viewBox="0 0 32 32" className="size-8" aria-hidden="true">
        <rect width="32" height="32" rx="8" className="fill-canvas-raised" />
        <path d="M7 15v7c0 1.7 4 3 9 3s9-1.3 9-3v-7" fill="none" strokeWidth="2.5" className="stroke-brand-700" />
        <ellipse cx="16" cy="15" rx="9" ry="3" strokeWidth="2.5" className="fill-accent-300 stroke-brand-700" />
        <path d="M9 5l9 8M23 5l-9 8" strokeWidth="2.2" strokeLinecap="round" className="stroke-ink" />
      </svg>
      <span className="text-xl font-bold tracking-tight">Kitlane</span>
    </span>
  );
}
