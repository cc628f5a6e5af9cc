import { MONEY_NOTICE } from '@shared/schemas/payments';

/** The words that go wherever money is shown (issue 4). */
export function MoneyNotice() {
  return <p className="mt-4 text-sm text-ink-muted">{MONEY_NOTICE}</p>;
}
