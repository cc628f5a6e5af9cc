import { useSearchParams } from 'react-router-dom';
import { formatMoney } from '@shared/money';
import { Alert, Button, Card, PageHeader, Spinner, TextField } from '@/components/ui';
import { AdminNav } from '@/features/admin/components/admin-nav';
import { BalancesTable, BookingLedgerTables } from '@/features/admin/components/ledger-tables';
import { useBookingLedger, useLedgerTotals, useReconciliation } from '@/features/admin/api/get-ledger';
import { QueryState } from '@/features/briefs/components/query-state';
import { useDocumentTitle } from '@/lib/use-document-title';

function Reconciliation() {
  const recon = useReconciliation();
  return (
    <Card className="space-y-3">
      <h2 className="text-xl font-bold">Reconcile with the payment processor</h2>
      <p className="text-ink-muted">Compares the ledger’s processor account with the processor’s balance, and every transfer and refund on both sides.</p>
      <Button variant="secondary" onClick={() => void recon.refetch()} busy={recon.isFetching} busyLabel="Asking the processor">
        Reconcile now
      </Button>
      {recon.error ? <Alert tone="error">The processor could not be asked: {recon.error.message}</Alert> : null}
      {recon.data ? (
        <div className="space-y-2" data-testid="reconciliation">
          <Alert tone={recon.data.ok ? 'success' : 'warning'} title={recon.data.ok ? 'The ledger and the processor agree' : 'Differences found'}>
            {recon.data.ok ? null : (
              <ul className="list-disc pl-5">
                {recon.data.differences.map((d) => (
                  <li key={d}>{d}</li>
                ))}
              </ul>
            )}
          </Alert>
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Processor balance per currency</caption>
            <thead>
              <tr>
                <th scope="col">Currency</th>
                <th scope="col" className="text-right">Ledger</th>
                <th scope="col" className="text-right">Processor</th>
                <th scope="col" className="text-right">Difference</th>
              </tr>
            </thead>
            <tbody>
              {recon.data.currencies.map((c) => (
                <tr key={c.currency}>
                  <td>{c.currency}</td>
                  <td className="text-right tabular-nums">{formatMoney(c.ledgerMinor, c.currency)}</td>
                  <td className="text-right tabular-nums">{formatMoney(c.processorMinor, c.currency)}</td>
                  <td className="text-right tabular-nums">{formatMoney(c.differenceMinor, c.currency)}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <p className="text-sm text-ink-muted">
            Transfers: {recon.data.transfers.ledgerCount} in the ledger, {recon.data.transfers.processorCount} at the processor. Refunds: {recon.data.refunds.ledgerCount} /{' '}
            {recon.data.refunds.processorCount}.
          </p>
        </div>
      ) : null}
    </Card>
  );
}

function OneBooking({ bookingId }: { bookingId: string }) {
  const ledger = useBookingLedger(bookingId);
  if (ledger.isPending) return <Spinner label="Loading the booking's ledger" />;
  if (ledger.error) return <Alert tone="error">{ledger.error.message}</Alert>;
  return <BookingLedgerTables ledger={ledger.data} />;
}

export function Component() {
  useDocumentTitle('Ledger');
  const [params, setParams] = useSearchParams();
  const bookingId = params.get('booking') ?? '';
  const totals = useLedgerTotals();
  return (
    <>
      <PageHeader title="Ledger" description="Double-entry, in minor units: every transaction balances, and each currency sums to zero." />
      <AdminNav />
      <div className="grid gap-6 lg:grid-cols-2">
        <Card className="space-y-3">
          <h2 className="text-xl font-bold">All accounts</h2>
          <QueryState isPending={totals.isPending} error={totals.error} retry={() => void totals.refetch()} loadingLabel="Loading the ledger">
            {() => (
              <>
                <p data-testid="ledger-totals">
                  {totals.data!.totals.length === 0
                    ? 'No money has moved yet.'
                    : totals.data!.totals.map((t) => `${t.currency}: sums to ${formatMoney(t.sum, t.currency)}`).join(' · ')}
                </p>
                <BalancesTable balances={totals.data!.accounts} caption="Balances of every account" />
              </>
            )}
          </QueryState>
        </Card>
        <div className="space-y-6">
          <Reconciliation />
          <Card className="space-y-3">
            <h2 className="text-xl font-bold">One booking</h2>
            <form
              onSubmit={(e) => {
                e.preventDefault();
                const value = String(new FormData(e.currentTarget).get('booking') ?? '').trim();
                setParams(value ? { booking: value } : {});
              }}
              className="flex flex-wrap items-end gap-3"
            >
              <TextField name="booking" label="Booking id" defaultValue={bookingId} className="min-w-64 flex-1" />
              <Button type="submit" variant="secondary">
                Show
              </Button>
            </form>
            {bookingId ? <OneBooking bookingId={bookingId} /> : <p className="text-ink-muted">Pick a booking from the bookings search, or paste its id.</p>}
          </Card>
        </div>
      </div>
    </>
  );
}
