import type { ReviewView } from '@shared/schemas/reviews';
import { Stars } from './stars';

export function ReviewList({ reviews, showSubject = false }: { reviews: ReviewView[]; showSubject?: boolean }) {
  return (
    <ul className="space-y-4">
      {reviews.map((r) => (
        <li key={r.id} className="border-b border-line pb-4 last:border-0 last:pb-0" data-testid="review">
          <p className="flex flex-wrap items-center gap-2">
            <Stars rating={r.rating} />
            <span className="font-medium">
              {showSubject ? `${r.subject.displayName} (${r.subject.role})` : r.songTitle}
            </span>
            <span className="text-sm text-ink-muted">
              by {r.reviewer.displayName}, {new Date(r.createdAt).toLocaleDateString(undefined, { dateStyle: 'medium' })}
            </span>
          </p>
          <p className="mt-1">{r.text}</p>
        </li>
      ))}
    </ul>
  );
}
