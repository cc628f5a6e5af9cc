import { formatMoney } from '@shared/money';
import type { BookingLedgerView, LedgerBalance } from '@shared/schemas/payments';
import { EmptyState } from '@/components/ui';

/** Debit-positive amounts (the ledger's sign convention), with the sign kept visible. */
function signed(amount: number, currency: string): string {
  return amount < 0 ? `−${formatMoney(-amount, currency)}` : formatMoney(amount, currency);
}

export function BalancesTable({ balances, caption }: { balances: LedgerBalance[]; caption: string }) {
  if (balances.length === 0) return <EmptyState title="No entries yet">Nothing has moved through the ledger here.</EmptyState>;
  return (
    <table className="w-full text-left text-sm">
      <caption className="sr-only">{caption}</caption>
      <thead>
        <tr className="border-b border-line">
          <th scope="col" className="py-1.5 pr-4">Account</th>
          <th scope="col" className="py-1.5 pr-4">Currency</th>
          <th scope="col" className="py-1.5 text-right">Balance (debit +, credit −)</th>
        </tr>
      </thead>
      <tbody>
        {balances.map((b) => (
          <tr key={`${b.account}|${b.currency}`} className="border-b border-line last:border-0">
            <td className="py-1.5 pr-4 font-mono break-all">{b.account}</td>
            <td className="py-1.5 pr-4">{b.currency}</td>
            <td className="py-1.5 text-right tabular-nums">{signed(b.balance, b.currency)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** One booking's ledger: every transaction with its balanced entries, oldest first. */
export function BookingLedgerTables({ ledger }: { ledger: BookingLedgerView }) {
  if (ledger.transactions.length === 0) return <EmptyState title="No money has moved">The booking has not been paid yet.</EmptyState>;
  const currency = ledger.currency ?? 'USD';
  return (
    <div className="space-y-4">
      <p>
        Held in escrow now: <strong data-testid="escrow-held">{formatMoney(ledger.escrowHeldMinor, currency)}</strong>
      </p>
      <ol className="space-y-3">
        {ledger.transactions.map((t) => (
          <li key={t.id} className="rounded-lg border border-line p-3">
            <p className="font-medium">
              {t.memo}
              <span className="ml-2 text-sm font-normal text-ink-muted">
                {new Date(t.createdAt).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' })}
                {t.externalId ? ` · ${t.externalId}` : ''}
              </span>
            </p>
            <table className="mt-2 w-full text-left text-sm">
              <caption className="sr-only">Entries of “{t.memo}”</caption>
              <thead>
                <tr>
                  <th scope="col" className="pr-4 font-medium text-ink-muted">Account</th>
                  <th scope="col" className="text-right font-medium text-ink-muted">Amount</th>
                </tr>
              </thead>
              <tbody>
                {t.entries.map((e, i) => (
                  <tr key={`${e.account}-${i}`}>
                    <td className="pr-4 font-mono break-all">{e.account}</td>
                    <td className="text-right tabular-nums">{signed(e.amount, t.currency)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </li>
        ))}
      </ol>
    </div>
  );
}
