/** A small count on a header icon; hidden from assistive tech because the button's label says it in words. */
export function CountBadge({ count }: { count: number }) {
  if (count <= 0) return null;
  return (
    <span aria-hidden="true" className="absolute -top-0.5 -right-0.5 flex h-5 min-w-5 items-center justify-center rounded-full bg-accent-300 px-1 text-xs font-bold text-ink ring-2 ring-brand-700">
      {count > 99 ? '99+' : count}
    </span>
  );
}
