import { useEffect, useRef } from 'react';
import { useSearchParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { formatMoney } from '@shared/money';
import type { BookingMoneyView, EscrowStage } from '@shared/schemas/payments';
import { Alert, Badge, Button, Card } from '@/components/ui';
import { isApiError } from '@/lib/api-client';
import { bookingKeys } from '@/features/bookings/api/keys';
import { useBookingMoney } from '../api/get-booking-money';
import { useStartCheckout } from '../api/start-checkout';
import { syncCheckout, useMoneyAction } from '../api/money-actions';
import { paymentKeys } from '../api/keys';
import { MoneyNotice } from './money-notice';

const STAGE_LABELS: Record<EscrowStage, { label: string; tone: 'neutral' | 'brand' | 'accent' | 'success' | 'danger' }> = {
  awaiting_payment: { label: 'Awaiting payment', tone: 'accent' },
  funded: { label: 'Funded: money held', tone: 'brand' },
  awaiting_release: { label: 'Awaiting release', tone: 'accent' },
  paid_out: { label: 'Paid out', tone: 'success' },
  refunded: { label: 'Refunded', tone: 'neutral' },
  cancelled: { label: 'Cancelled', tone: 'neutral' },
  settled: { label: 'Settled', tone: 'neutral' },
};

function errorText(error: unknown): string {
  return isApiError(error) || error instanceof Error ? error.message : 'Please try again.';
}

function Row({ label, value }: { label: string; value: string }) {
  return (
    <div className="flex justify-between gap-4 py-1">
      <dt className="text-ink-muted">{label}</dt>
      <dd className="font-medium tabular-nums">{value}</dd>
    </div>
  );
}

function Amounts({ money }: { money: BookingMoneyView }) {
  const m = (minor: number) => formatMoney(minor, money.currency);
  return (
    <dl className="divide-y divide-line">
      <Row label="Agreed total" value={m(money.checkout.agreedMinor)} />
      <Row label="Service fee" value={m(money.checkout.serviceFeeMinor)} />
      <Row label="Checkout total" value={m(money.checkout.totalMinor)} />
      {money.paidMinor > 0 ? <Row label="Paid so far" value={m(money.paidMinor)} /> : null}
      <Row label="Held for this booking" value={m(money.escrowHeldMinor)} />
    </dl>
  );
}

function Payouts({ money }: { money: BookingMoneyView }) {
  if (money.payouts.length === 0) return null;
  const words = { pending: 'Sending', waiting_account: 'Waiting for a payout account', done: 'Sent', failed: 'Failed: an admin will look at it' } as const;
  return (
    <section aria-labelledby="payouts-title" className="mt-4">
      <h3 id="payouts-title" className="font-semibold">
        Payouts and refunds
      </h3>
      <ul className="mt-2 space-y-1 text-sm">
        {money.payouts.map((p) => (
          <li key={p.id} className="flex justify-between gap-4">
            <span>{p.kind === 'refund' ? 'Refund to the songwriter' : `To ${p.payee?.displayName ?? 'the payee'}`}: {words[p.status]}</span>
            <span className="tabular-nums">{formatMoney(p.amountMinor, p.currency)}</span>
          </li>
        ))}
      </ul>
    </section>
  );
}

function Receipts({ money }: { money: BookingMoneyView }) {
  if (money.receipts.length === 0) return null;
  return (
    <section aria-labelledby="receipts-title" className="mt-4">
      <h3 id="receipts-title" className="font-semibold">
        Receipts
      </h3>
      <ul className="mt-2 space-y-2 text-sm">
        {money.receipts.map((r) => (
          <li key={r.id} className="rounded border border-line p-2">
            <div className="flex justify-between gap-4">
              <span>{r.title}</span>
              <span className="font-medium tabular-nums">{formatMoney(r.amountMinor, r.currency)}</span>
            </div>
            <div className="text-ink-muted">
              {new Date(r.at).toLocaleString()} {r.reference ? `· reference ${r.reference}` : ''}
            </div>
          </li>
        ))}
      </ul>
    </section>
  );
}

/** After the hosted checkout sends the songwriter back: read the session once, then poll until funded. */
function useCheckoutReturn(bookingId: string): boolean {
  const [params] = useSearchParams();
  const queryClient = useQueryClient();
  const sessionId = params.get('session_id');
  const returned = params.get('checkout') === 'success' && !!sessionId;
  const synced = useRef(false);
  useEffect(() => {
    if (!returned || synced.current || !sessionId) return;
    synced.current = true;
    void syncCheckout(bookingId, sessionId).finally(() => {
      void queryClient.invalidateQueries({ queryKey: paymentKeys.money(bookingId) });
      void queryClient.invalidateQueries({ queryKey: bookingKeys.detail(bookingId) });
    });
  }, [returned, sessionId, bookingId, queryClient]);
  return returned;
}

export function EscrowPanel({ bookingId }: { bookingId: string }) {
  const returned = useCheckoutReturn(bookingId);
  const query = useBookingMoney(bookingId, returned);
  const pay = useStartCheckout(bookingId, 'booking');
  const payAddOn = useStartCheckout(bookingId, 'add_on');
  const cancel = useMoneyAction(bookingId, 'cancel');
  const release = useMoneyAction(bookingId, 'release');

  if (query.isPending) return <Card><p role="status">Loading the payment status…</p></Card>;
  if (query.error) return <Alert tone="error" title="The payment status could not be loaded">{errorText(query.error)}</Alert>;
  const money = query.data;
  const stage = STAGE_LABELS[money.stage];
  const openPayment = money.payments.filter((p) => p.status === 'open' || p.status === 'creating').at(-1);
  const actionError = pay.error ?? payAddOn.error ?? cancel.error ?? release.error;

  return (
    <section aria-labelledby="money-title" className="mb-6">
      <Card>
        <div className="mb-3 flex flex-wrap items-center justify-between gap-2">
          <h2 id="money-title" className="text-xl font-bold">
            Payment
          </h2>
          <Badge tone={stage.tone}>{stage.label}</Badge>
        </div>
        {returned && money.stage === 'awaiting_payment' ? <Alert tone="info" className="mb-3">Payment received by the processor; confirming it…</Alert> : null}
        {openPayment?.lastError ? (
          <Alert tone="error" title="The card was declined" className="mb-3">
            {openPayment.lastError}. Nothing was charged; you can pay again with another card.
          </Alert>
        ) : null}
        {money.autoAcceptAt ? (
          <Alert tone="info" className="mb-3">
            Unless the songwriter answers, this delivery is accepted and the money released on{' '}
            <strong>{new Date(money.autoAcceptAt).toLocaleDateString(undefined, { dateStyle: 'long' })}</strong>. Opening a dispute stops this.
          </Alert>
        ) : null}
        {money.addOn.needed > 0 ? (
          <Alert tone="warning" className="mb-3">
            The changes asked for go beyond the included revisions: {money.addOn.needed} extra revision{money.addOn.needed === 1 ? '' : 's'} for{' '}
            {formatMoney(money.addOn.amountMinor, money.currency)} plus {formatMoney(money.addOn.feeMinor, money.currency)} service fee, paid before work goes on.
          </Alert>
        ) : null}
        {money.cancelRequestedBy.length > 0 && money.stage === 'funded' ? (
          <Alert tone="warning" className="mb-3">A cancellation was asked for. When every party agrees, the payment is refunded in full.</Alert>
        ) : null}
        <Amounts money={money} />
        <div className="mt-4 flex flex-wrap gap-2">
          {money.can.pay ? (
            <Button busy={pay.isPending} busyLabel="Opening checkout…" onClick={() => pay.mutate()}>
              Pay {formatMoney(money.checkout.totalMinor, money.currency)}
            </Button>
          ) : null}
          {money.can.payAddOn ? (
            <Button busy={payAddOn.isPending} busyLabel="Opening checkout…" onClick={() => payAddOn.mutate()}>
              Pay for extra revisions
            </Button>
          ) : null}
          {money.can.release ? (
            <Button variant="secondary" busy={release.isPending} busyLabel="Releasing…" onClick={() => release.mutate()}>
              Release the money
            </Button>
          ) : null}
          {money.can.cancel ? (
            <Button variant="danger" busy={cancel.isPending} busyLabel="Cancelling…" onClick={() => cancel.mutate()}>
              {money.stage === 'awaiting_payment' ? 'Cancel booking' : 'Ask to cancel and refund'}
            </Button>
          ) : null}
        </div>
        {actionError ? (
          <Alert tone="error" className="mt-3">
            {errorText(actionError)}
          </Alert>
        ) : null}
        <Payouts money={money} />
        <Receipts money={money} />
        <MoneyNotice />
      </Card>
    </section>
  );
}
