import { invalidRequest } from './errors';

/** REFERENCES.md (Stripe, public docs): currencies whose API amounts carry no minor unit. */
export const ZERO_DECIMAL_CURRENCIES: ReadonlySet<string> = new Set([
  'bif', 'clp', 'djf', 'gnf', 'jpy', 'kmf', 'krw', 'mga', 'pyg', 'rwf', 'ugx', 'vnd', 'vuv', 'xaf', 'xof', 'xpf',
]);

/**
 * Minimum charge per currency, in the API's units. USD 0.50 is in REFERENCES.md; the brief fixes EUR and
 * GBP at 50 minor units too. The others are from memory of the public "minimum and maximum charge
 * amounts" table and can be overridden with the `minimumAmounts` option. (From memory, the hosted table
 * lists GBP at 0.30, so this fake is stricter for GBP: whatever it accepts the real service accepts.)
 */
export const DEFAULT_MINIMUM_AMOUNTS: Readonly<Record<string, number>> = {
  usd: 50,
  eur: 50,
  gbp: 50,
  aud: 50,
  cad: 50,
  chf: 50,
  nzd: 50,
  sgd: 50,
  dkk: 250,
  nok: 300,
  sek: 300,
  pln: 200,
  czk: 1500,
  hkd: 400,
  mxn: 1000,
  jpy: 50,
};

/** REFERENCES.md: amounts have at most 8 digits (99,999,999 in the currency's API unit). */
export const MAX_AMOUNT = 99_999_999;

export type MinimumTable = Readonly<Record<string, number>>;

/** Currencies the fake accepts: those with a known minimum, plus every zero-decimal one. */
export function isSupportedCurrency(currency: string, minimums: MinimumTable): boolean {
  return currency in minimums || ZERO_DECIMAL_CURRENCIES.has(currency);
}

export function minorUnitDigits(currency: string): number {
  return ZERO_DECIMAL_CURRENCIES.has(currency) ? 0 : 2;
}

/** `1234, 'usd'` → "$12.34"; `1000, 'jpy'` → "¥1,000". Uses the fake's own minor-unit list, not Intl's. */
export function formatAmount(amount: number, currency: string): string {
  const digits = minorUnitDigits(currency);
  const major = amount / 10 ** digits;
  try {
    return new Intl.NumberFormat('en-US', {
      style: 'currency',
      currency: currency.toUpperCase(),
      minimumFractionDigits: digits,
      maximumFractionDigits: digits,
    }).format(major);
  } catch {
    return `${major.toFixed(digits)} ${currency.toUpperCase()}`;
  }
}

export function checkCurrency(currency: string, minimums: MinimumTable, param = 'currency'): string {
  const lower = currency.toLowerCase();
  if (!isSupportedCurrency(lower, minimums)) {
    throw invalidRequest(`Invalid currency: ${currency}. This fake supports: ${supportedList(minimums)}.`, {
      code: 'parameter_invalid',
      param,
    });
  }
  return lower;
}

function supportedList(minimums: MinimumTable): string {
  return [...new Set([...Object.keys(minimums), ...ZERO_DECIMAL_CURRENCIES])].sort().join(', ');
}

/** Positive, at most 8 digits. Used for every amount (charges, refunds, transfers, reversals). */
export function checkAmountRange(amount: number, currency: string, param = 'amount'): void {
  if (!Number.isSafeInteger(amount) || amount < 1) {
    throw invalidRequest('This value must be greater than or equal to 1.', { code: 'parameter_invalid_integer', param });
  }
  if (amount > MAX_AMOUNT) {
    throw invalidRequest(`Amount must be no more than ${formatAmount(MAX_AMOUNT, currency)}`, { code: 'amount_too_large', param });
  }
}

/** The minimum applies to what a customer pays (charges, checkout totals), not to refunds or transfers. */
export function checkMinimumCharge(amount: number, currency: string, minimums: MinimumTable, param = 'amount'): void {
  const minimum = minimums[currency] ?? 1;
  if (amount < minimum) {
    throw invalidRequest(`Amount must be at least ${formatAmount(minimum, currency)} ${currency}`, {
      code: 'amount_too_small',
      param,
    });
  }
}
