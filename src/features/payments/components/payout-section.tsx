import { useEffect, useRef } from 'react';
import { useSearchParams } from 'react-router-dom';
import { formatMoney } from '@shared/money';
import { Alert, Badge, Button } from '@/components/ui';
import { isApiError } from '@/lib/api-client';
import { usePayoutAccount, useRefreshPayoutAccount, useStartOnboarding } from '../api/payout-account';
import { MoneyNotice } from './money-notice';

/** The account page's payout part for drummers and engineers: connect, see whether payouts are enabled. */
export function PayoutSection() {
  const account = usePayoutAccount(true);
  const onboarding = useStartOnboarding();
  const refresh = useRefreshPayoutAccount();
  const [params] = useSearchParams();
  const back = params.get('payouts');
  const refreshed = useRef(false);
  const refreshMutate = refresh.mutate;
  useEffect(() => {
    // Back from the processor's page: read the account's state now instead of waiting for its webhook.
    if (back && !refreshed.current) {
      refreshed.current = true;
      refreshMutate();
    }
  }, [back, refreshMutate]);

  if (account.isPending) return <p role="status">Loading the payout account…</p>;
  if (account.error) return <Alert tone="error">{isApiError(account.error) ? account.error.message : 'The payout account could not be loaded.'}</Alert>;
  const a = account.data;
  return (
    <div>
      <p className="mb-3 flex items-center gap-2">
        <span>Payouts:</span>
        <Badge tone={a.payoutsEnabled ? 'success' : 'accent'}>{a.payoutsEnabled ? 'Enabled' : a.connected ? 'Onboarding not finished' : 'Not set up'}</Badge>
      </p>
      {a.waiting.length > 0 ? (
        <Alert tone="warning" className="mb-3" title="Money is waiting for you">
          <ul>
            {a.waiting.map((w, i) => (
              <li key={`${w.bookingId}-${i}`}>{formatMoney(w.amountMinor, w.currency)} is released to you and goes out once payouts are enabled.</li>
            ))}
          </ul>
        </Alert>
      ) : null}
      {a.payoutsEnabled ? (
        <p>Released money is transferred to your payout account at the payment processor.</p>
      ) : (
        <>
          <p className="mb-3">Connect a payout account at the payment processor to receive your share when a booking is released.</p>
          <Button busy={onboarding.isPending} busyLabel="Opening…" onClick={() => onboarding.mutate()}>
            {a.connected ? 'Continue payout setup' : 'Set up payouts'}
          </Button>
        </>
      )}
      {onboarding.error ? <Alert tone="error" className="mt-3">{onboarding.error.message}</Alert> : null}
      <MoneyNotice />
    </div>
  );
}
