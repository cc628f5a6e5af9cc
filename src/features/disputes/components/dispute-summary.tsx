import { formatMoney } from '@shared/money';
import { DISPUTE_OUTCOME_LABELS, DISPUTE_REASON_LABELS, type DisputeView } from '@shared/schemas/disputes';
import { Badge } from '@/components/ui';

function formatDate(iso: string): string {
  return new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' });
}

/** One dispute as both sides see it: why it was opened and, once settled, the decision with its amounts. */
export function DisputeSummary({ dispute }: { dispute: DisputeView }) {
  const settled = dispute.status === 'settled';
  return (
    <article className="space-y-3" aria-label={`Dispute opened ${formatDate(dispute.createdAt)}`} data-testid="dispute-summary" data-status={dispute.status}>
      <p className="flex flex-wrap items-center gap-2">
        <Badge tone={settled ? 'success' : 'danger'}>{settled ? 'Settled' : dispute.settling ? 'Being settled' : 'Open'}</Badge>
        <span className="font-medium">{DISPUTE_REASON_LABELS[dispute.reason]}</span>
        <span className="text-ink-muted">
          opened by {dispute.openedBy.displayName} ({dispute.openedBy.role}) on {formatDate(dispute.createdAt)}
        </span>
      </p>
      <blockquote className="border-l-4 border-line-strong pl-3 text-ink-muted">{dispute.text}</blockquote>
      {settled && dispute.outcome && dispute.amounts ? (
        <div className="rounded-lg bg-canvas-sunken p-4" data-testid="dispute-decision">
          <p className="font-bold">Decision: {DISPUTE_OUTCOME_LABELS[dispute.outcome]}</p>
          <dl className="mt-2 grid gap-x-6 gap-y-1 sm:grid-cols-[auto_1fr]">
            <dt className="text-ink-muted">Held in escrow</dt>
            <dd>{formatMoney(dispute.amounts.heldMinor, dispute.amounts.currency)}</dd>
            <dt className="text-ink-muted">Refunded to the songwriter</dt>
            <dd data-testid="decision-songwriter">
              {formatMoney(dispute.amounts.songwriterMinor, dispute.amounts.currency)}
              {dispute.amounts.serviceFeeRefundMinor > 0 ? ` plus the service fee of ${formatMoney(dispute.amounts.serviceFeeRefundMinor, dispute.amounts.currency)}` : ''}
            </dd>
            <dt className="text-ink-muted">Released to the payees</dt>
            <dd data-testid="decision-payees">{formatMoney(dispute.amounts.payeesMinor, dispute.amounts.currency)} (before the platform commission)</dd>
          </dl>
          {dispute.decisionNote ? <p className="mt-3">The admin’s reasons: {dispute.decisionNote}</p> : null}
          {dispute.settledAt ? <p className="mt-1 text-sm text-ink-muted">Settled on {formatDate(dispute.settledAt)}</p> : null}
        </div>
      ) : (
        <p className="text-sm text-ink-muted">The money stays held by the payment processor until an admin decides. Both sides get the decision in writing.</p>
      )}
    </article>
  );
}
