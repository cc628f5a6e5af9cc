import type { PackagePair } from '@shared/mic-package';
import { SOURCES } from '@shared/mic-package';

const KIND_LABELS: Record<PackagePair['kind'], string> = {
  top_bottom: 'Top and bottom',
  in_out: 'In and out',
  overhead_pair: 'Overhead pair',
  close_overhead: 'Close mic and overhead',
};

/** The related channels and the polarity the delivery check should expect between their stems. */
export function PackagePairs({ pairs }: { pairs: PackagePair[] }) {
  const main = pairs.filter((p) => p.kind !== 'close_overhead');
  if (pairs.length === 0) return <p className="text-ink-muted">No related pairs in this list.</p>;
  return (
    <div className="space-y-2">
      <ul className="space-y-2">
        {main.map((p) => (
          <li key={`${p.aChannel}-${p.bChannel}`} className="text-sm">
            <span className="font-medium">
              {KIND_LABELS[p.kind]}: ch {p.aChannel} {SOURCES[p.aSource].label} / ch {p.bChannel} {SOURCES[p.bSource].label}
            </span>{' '}
            — expected {p.expectInverted === null ? 'no fixed polarity' : p.expectInverted ? 'inverted' : 'same polarity'}. <span className="text-ink-muted">{p.reason}</span>
          </li>
        ))}
      </ul>
      <p className="text-sm text-ink-muted">
        Plus {pairs.length - main.length} close-mic/overhead pairs the delivery check compares for time offset and polarity.
      </p>
    </div>
  );
}
