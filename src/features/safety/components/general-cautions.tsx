import { PLACEMENT_GUIDANCE } from '@shared/mic-package';
import { Card } from '@/components/ui';

/** The general cautions for a session (stands, cables, top-heavy room stands), marked as common practice. */
export function GeneralCautions() {
  const general = PLACEMENT_GUIDANCE.find((g) => g.id === 'general');
  if (!general) return null;
  return (
    <Card className="space-y-2">
      <h2 className="text-xl font-bold">
        {general.title} <span className="text-sm font-normal text-ink-muted">({general.basis})</span>
      </h2>
      <ul className="list-disc space-y-1 pl-5">
        {general.points.map((p) => (
          <li key={p}>{p}</li>
        ))}
      </ul>
    </Card>
  );
}
