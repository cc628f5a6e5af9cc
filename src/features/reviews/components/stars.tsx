/** A rating as five stars with the number in words for screen readers. */
export function Stars({ rating, className }: { rating: number; className?: string }) {
  const whole = Math.round(rating);
  return (
    <span className={className} role="img" aria-label={`${rating} out of 5 stars`}>
      <span aria-hidden="true" className="tracking-tight text-accent-700">
        {'★'.repeat(whole)}
        <span className="text-line-strong">{'★'.repeat(5 - whole)}</span>
      </span>
    </span>
  );
}
