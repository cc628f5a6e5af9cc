import type { QuoteStatus } from '@shared/schemas/quotes';
import { Badge } from '@/components/ui';

const LOOK: Record<QuoteStatus, { label: string; tone: 'neutral' | 'brand' | 'accent' | 'success' | 'danger' }> = {
  sent: { label: 'Sent', tone: 'brand' },
  accepted: { label: 'Accepted', tone: 'success' },
  declined: { label: 'Declined', tone: 'danger' },
  withdrawn: { label: 'Withdrawn', tone: 'neutral' },
  expired: { label: 'Expired', tone: 'accent' },
};

export function QuoteStatusBadge({ status }: { status: QuoteStatus }) {
  const look = LOOK[status];
  return <Badge tone={look.tone}>{look.label}</Badge>;
}
