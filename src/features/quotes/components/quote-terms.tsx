import { formatMoney } from '@shared/money';
import { LEGAL_CAUTION, RIGHTS_LABELS, type QuoteLineItemView, type RightsTerms } from '@shared/schemas/quotes';

/** The priced lines and the total, formatted with Intl from the server's integer minor units. */
export function LineItems({ items, totalMinor, currency, extraRevisionMinor }: { items: QuoteLineItemView[]; totalMinor: number; currency: string; extraRevisionMinor: number }) {
  return (
    <table className="w-full text-left">
      <caption className="sr-only">Price</caption>
      <tbody className="divide-y divide-line">
        {items.map((item, i) => (
          <tr key={i}>
            <th scope="row" className="py-1.5 pr-3 font-normal">
              {item.label}
              {item.quantity > 1 ? <span className="text-ink-muted"> ({formatMoney(item.unitAmount, currency)} each)</span> : null}
            </th>
            <td className="py-1.5 text-right tabular-nums">{formatMoney(item.unitAmount * item.quantity, currency)}</td>
          </tr>
        ))}
        <tr>
          <th scope="row" className="py-1.5 pr-3 font-bold">
            Total
          </th>
          <td className="py-1.5 text-right font-bold tabular-nums" data-testid="quote-total">
            {formatMoney(totalMinor, currency)}
          </td>
        </tr>
        {extraRevisionMinor > 0 ? (
          <tr>
            <th scope="row" className="py-1.5 pr-3 font-normal text-ink-muted">
              Each extra revision (not in the total)
            </th>
            <td className="py-1.5 text-right tabular-nums text-ink-muted">{formatMoney(extraRevisionMinor, currency)}</td>
          </tr>
        ) : null}
      </tbody>
    </table>
  );
}

export function RightsText({ terms, points }: { terms: RightsTerms; points: number | null }) {
  const label = RIGHTS_LABELS[terms];
  return (
    <div>
      <p className="font-medium">
        {label.title}
        {terms === 'points' && points != null ? `: ${points} ${points === 1 ? 'point' : 'points'}` : ''}
      </p>
      <p className="text-sm text-ink-muted">{label.explain}</p>
    </div>
  );
}

export function LegalCaution() {
  return <p className="text-sm text-ink-muted">{LEGAL_CAUTION}</p>;
}
