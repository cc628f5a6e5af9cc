import type { QuoteStatus, QuoteView } from '@shared/schemas/quotes';
import type { QuoteRow, QuoteWithNames } from './quotes.repository';

/** Expiry is checked on read: a sent quote past its validUntil reads as expired; no job rewrites rows. */
export function effectiveStatus(q: Pick<QuoteRow, 'status' | 'validUntil'>, now: Date): QuoteStatus {
  return q.status === 'sent' && q.validUntil.getTime() <= now.getTime() ? 'expired' : q.status;
}

/** Why the songwriter cannot accept this quote right now; null when they can. */
export function blockedReason(q: QuoteWithNames, now: Date): string | null {
  const status = effectiveStatus(q, now);
  if (status !== 'sent') return `This quote is ${status}`;
  if (q.briefStatus !== 'open') return 'The brief is no longer open';
  if (q.engineerStatus === 'pending') return 'Waiting for the engineer to confirm being part of this quote';
  if (q.engineerStatus === 'declined') return 'The engineer declined to be part of this quote';
  return null;
}

export function toQuoteView(q: QuoteWithNames, now: Date): QuoteView {
  return {
    id: q.id,
    briefId: q.briefId,
    briefTitle: q.briefTitle,
    drummerId: q.drummerId,
    drummerName: q.drummerName,
    status: effectiveStatus(q, now),
    lineItems: q.lineItems,
    totalMinor: q.totalMinor,
    currency: q.currency,
    drummerShareMinor: q.totalMinor - q.engineerShareMinor,
    revisionsIncluded: q.revisionsIncluded,
    extraRevisionMinor: q.extraRevisionMinor,
    turnaroundDays: q.turnaroundDays,
    recordingDate: q.recordingDate,
    rightsTerms: q.rightsTerms,
    royaltyPoints: q.royaltyPoints,
    message: q.message,
    validUntil: q.validUntil.toISOString(),
    packageId: q.packageId,
    engineer:
      q.engineerId && q.engineerStatus !== 'none'
        ? { id: q.engineerId, displayName: q.engineerName ?? 'Engineer', shareMinor: q.engineerShareMinor, status: q.engineerStatus }
        : null,
    declineReason: q.declineReason,
    blockedReason: blockedReason(q, now),
    createdAt: q.createdAt.toISOString(),
  };
}
