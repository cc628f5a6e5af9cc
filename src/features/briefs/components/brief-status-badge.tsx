import type { BriefStatus } from '@shared/schemas/briefs';
import { Badge } from '@/components/ui';

const LOOK: Record<BriefStatus, { label: string; tone: 'neutral' | 'brand' | 'accent' | 'success' | 'danger' }> = {
  draft: { label: 'Draft', tone: 'neutral' },
  open: { label: 'Open', tone: 'brand' },
  hired: { label: 'Hired', tone: 'success' },
  closed: { label: 'Closed', tone: 'neutral' },
  withdrawn: { label: 'Withdrawn', tone: 'danger' },
};

export function BriefStatusBadge({ status }: { status: BriefStatus }) {
  const look = LOOK[status];
  return <Badge tone={look.tone}>{look.label}</Badge>;
}
