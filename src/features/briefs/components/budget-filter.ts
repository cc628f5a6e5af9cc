import { fromMinor, MoneyError, toMinor } from '@shared/money';

/**
 * The Open briefs budget filter: people type major units ("250" or "250.50") in a chosen currency, the API
 * takes minor units plus that currency (minor units of two currencies cannot be compared).
 */
export type BudgetFilterResult = { ok: true; budgetMin: number | undefined } | { ok: false; message: string };

export function budgetMinFromText(text: string, currency: string): BudgetFilterResult {
  const trimmed = text.trim();
  if (trimmed === '') return { ok: true, budgetMin: undefined };
  try {
    const minor = toMinor(trimmed, currency);
    if (minor < 0) return { ok: false, message: 'A budget cannot be negative' };
    return { ok: true, budgetMin: minor };
  } catch (error) {
    return { ok: false, message: error instanceof MoneyError ? error.message : 'Enter an amount like 250 or 250.50' };
  }
}

/** What the field shows for a filter already in the address: the same major units the person typed. */
export function budgetMinText(budgetMin: number | undefined, currency: string): string {
  return budgetMin === undefined ? '' : fromMinor(budgetMin, currency);
}
