import type { DisputeCaseView } from '@shared/schemas/admin';
import { AUDIT_ACTION_LABELS } from '@shared/schemas/admin';
import { formatMoney } from '@shared/money';
import { Card, EmptyState } from '@/components/ui';
import { BookingTerms } from '@/features/bookings/components/booking-terms';
import { DisputeSummary } from '@/features/disputes/components/dispute-summary';
import { BookingLedgerTables } from './ledger-tables';
import { SettlementForm } from './settlement-form';

const LEVEL_TONE = { pass: 'text-success-700', warn: 'text-ink', fail: 'text-danger-700' } as const;
const LEVEL_WORD = { pass: 'Pass', warn: 'Warning', fail: 'Fail' } as const;

function when(iso: string): string {
  return new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' });
}

function Messages({ file }: { file: DisputeCaseView }) {
  if (file.messages.length === 0) return <EmptyState title="No messages">The two sides did not write to each other on Kitlane.</EmptyState>;
  return (
    <ol className="space-y-3">
      {file.messages.map((m) => (
        <li key={m.id} className="rounded-lg bg-canvas-sunken p-3">
          <p className="text-sm text-ink-muted">
            <span className="font-medium text-ink">{m.senderName}</span> · {m.thread === 'brief' ? 'before hiring' : 'booking'} · {when(m.createdAt)}
          </p>
          <p className="mt-1 whitespace-pre-wrap">{m.body}</p>
          {m.attachmentName ? <p className="mt-1 text-sm">Attachment: {m.attachmentName}</p> : null}
        </li>
      ))}
    </ol>
  );
}

function Deliveries({ file }: { file: DisputeCaseView }) {
  if (file.deliveries.items.length === 0) return <EmptyState title="No delivery yet">No stems were delivered for this booking.</EmptyState>;
  return (
    <ol className="space-y-4">
      {file.deliveries.items.map((d) => (
        <li key={d.id} className="rounded-lg border border-line p-3">
          <p className="font-medium">
            Delivery {d.number !== null ? `v${d.number}` : d.id.slice(0, 8)} {d.status ? `· ${d.status}` : ''} {d.createdAt ? `· ${when(d.createdAt)}` : ''}
          </p>
          {d.report ? (
            <>
              <p className="mt-1">{d.report.summary}</p>
              <ul className="mt-2 space-y-1">
                {d.report.checks.map((c) => (
                  <li key={c.id} className={LEVEL_TONE[c.level]}>
                    <span className="font-bold">{LEVEL_WORD[c.level]}:</span> {c.message}
                  </li>
                ))}
              </ul>
            </>
          ) : (
            <p className="mt-1 text-ink-muted">No check report for this delivery yet.</p>
          )}
        </li>
      ))}
    </ol>
  );
}

/** Everything an admin needs to decide, and the decision itself while the dispute is open. */
export function DisputeCase({ file }: { file: DisputeCaseView }) {
  const { dispute, booking } = file;
  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_minmax(0,26rem)]">
      <div className="space-y-6">
        <Card className="space-y-3">
          <h2 className="text-xl font-bold">The dispute</h2>
          <DisputeSummary dispute={dispute} />
          <p className="text-sm text-ink-muted">
            Songwriter {booking.songwriter.displayName} · drummer {booking.drummer.displayName}
            {booking.engineer ? ` · engineer ${booking.engineer.displayName}` : ''}
          </p>
        </Card>
        {/* The frozen terms carry their own "Agreed terms" heading. */}
        <BookingTerms booking={booking} />
        <Card className="space-y-3">
          <h2 className="text-xl font-bold">Messages</h2>
          <Messages file={file} />
        </Card>
        <Card className="space-y-3">
          <h2 className="text-xl font-bold">Deliveries and check reports</h2>
          <Deliveries file={file} />
        </Card>
      </div>
      <div className="space-y-6">
        <Card className="space-y-3">
          <h2 className="text-xl font-bold">Decision</h2>
          {dispute.status === 'open' && !dispute.settling ? (
            <SettlementForm disputeId={dispute.id} currency={booking.currency} heldMinor={file.ledger.escrowHeldMinor} />
          ) : dispute.settling ? (
            <p>The decision is being carried out by the payment processor; this page updates when it is done.</p>
          ) : (
            <p>Settled. The decision and its amounts are shown with the dispute.</p>
          )}
        </Card>
        <Card className="space-y-3">
          <h2 className="text-xl font-bold">Ledger of this booking</h2>
          <BookingLedgerTables ledger={file.ledger} />
        </Card>
        <Card className="space-y-3">
          <h2 className="text-xl font-bold">Admin actions</h2>
          {file.audit.length === 0 ? (
            <p className="text-ink-muted">None yet.</p>
          ) : (
            <ul className="space-y-2">
              {file.audit.map((a) => (
                <li key={a.id}>
                  <span className="font-medium">{AUDIT_ACTION_LABELS[a.action]}</span> by {a.actor.displayName}, {when(a.createdAt)}
                  {a.amounts?.songwriterMinor !== undefined ? ` · songwriter ${formatMoney(a.amounts.songwriterMinor, a.amounts.currency)}` : ''}
                  {a.amounts?.payeesMinor !== undefined ? ` · payees ${formatMoney(a.amounts.payeesMinor, a.amounts.currency)}` : ''}
                </li>
              ))}
            </ul>
          )}
        </Card>
        {file.earlier.length > 0 ? (
          <Card className="space-y-3">
            <h2 className="text-xl font-bold">Earlier disputes on this booking</h2>
            {file.earlier.map((d) => (
              <DisputeSummary key={d.id} dispute={d} />
            ))}
          </Card>
        ) : null}
      </div>
    </div>
  );
}
