// Currencies Kitlane prices in, their minor units, and conversion between the decimal text people type
// and the integer minor units everything else stores (DESIGN.md, Money: never floats for money).
import { parseDecimal } from './decimal';
import { assertSafeInteger, MoneyError } from './errors';

export const SUPPORTED_CURRENCIES = ['USD', 'EUR', 'GBP', 'CAD', 'AUD', 'JPY', 'SEK', 'NOK', 'DKK', 'CHF', 'NZD', 'KRW'] as const;
export type CurrencyCode = (typeof SUPPORTED_CURRENCIES)[number];

/**
 * Currencies the processor takes in whole units, with no minor unit (REFERENCES.md, Payments — Stripe:
 * "zero-decimal currencies"; Stripe docs, Supported currencies). Kept whole, not only the ones we
 * support, so adding a currency cannot silently get its exponent wrong.
 */
export const ZERO_DECIMAL_CURRENCIES: readonly string[] = [
  'BIF', 'CLP', 'DJF', 'GNF', 'JPY', 'KMF', 'KRW', 'MGA', 'PYG', 'RWF', 'UGX', 'VND', 'VUV', 'XAF', 'XOF', 'XPF',
];

/**
 * The processor's largest amount: at most 8 digits in minor units, e.g. 99999999 = USD 999,999.99
 * (REFERENCES.md, Payments — Stripe: "Amounts: integer minor units, at most 8 digits").
 */
export const MAX_PROCESSOR_AMOUNT = 99_999_999;

/**
 * The processor's smallest charge per currency, in minor units. USD 0.50 is from REFERENCES.md
 * (Stripe docs, minimum and maximum charge amounts). GBP 0.30 and JPY 50 are the same Stripe table as
 * quoted by third-party help pages; the rest are from memory of that table. KRW has no entry there
 * that we could verify: 700 won (about USD 0.50) is our own conservative choice.
 */
export const PROCESSOR_MINIMUM_CHARGE: Readonly<Record<CurrencyCode, number>> = {
  USD: 50,
  EUR: 50,
  GBP: 30,
  CAD: 50,
  AUD: 50,
  NZD: 50,
  CHF: 50,
  JPY: 50,
  KRW: 700,
  SEK: 300,
  NOK: 300,
  DKK: 250,
};

export function isSupportedCurrency(code: string): code is CurrencyCode {
  return (SUPPORTED_CURRENCIES as readonly string[]).includes(code);
}

/** Accepts any case ("usd" is what the processor's API speaks) and returns the ISO upper-case code. */
export function parseCurrency(code: string): CurrencyCode {
  const upper = typeof code === 'string' ? code.trim().toUpperCase() : '';
  if (!isSupportedCurrency(upper)) {
    throw new MoneyError('invalid_currency', `Unsupported currency "${String(code)}"; use one of ${SUPPORTED_CURRENCIES.join(', ')}`);
  }
  return upper;
}

/** Digits after the decimal point: 0 for zero-decimal currencies, 2 for every other supported one. */
export function minorUnitExponent(code: string): 0 | 2 {
  return ZERO_DECIMAL_CURRENCIES.includes(parseCurrency(code)) ? 0 : 2;
}

/**
 * "12.50" USD → 1250; "1200" JPY → 1200. More decimals than the currency has are refused rather than
 * rounded ("12.345" USD, "1.5" JPY): a price someone typed should never change silently.
 * Trailing zeros are fine ("12.500" USD → 1250).
 */
export function toMinor(major: string | number, currency: string): number {
  const exponent = minorUnitExponent(currency);
  const value = parseDecimal(major);
  let minor: bigint;
  if (value.scale > exponent) {
    const divisor = 10n ** BigInt(value.scale - exponent);
    if (value.coefficient % divisor !== 0n) {
      const allowed = exponent === 0 ? 'no decimals' : `at most ${exponent} decimals`;
      throw new MoneyError('too_many_decimals', `${parseCurrency(currency)} amounts have ${allowed}, got "${String(major)}"`);
    }
    minor = value.coefficient / divisor;
  } else {
    minor = value.coefficient * 10n ** BigInt(exponent - value.scale);
  }
  if (minor > BigInt(Number.MAX_SAFE_INTEGER)) {
    throw new MoneyError('amount_too_large', `"${String(major)}" is too large to store exactly`);
  }
  const result = Number(minor);
  return value.negative ? -result : result;
}

/** 1250 USD → "12.50"; -5 USD → "-0.05"; 1200 JPY → "1200". Plain text, for forms and APIs. */
export function fromMinor(minor: number, currency: string): string {
  assertSafeInteger(minor, 'Amount');
  const exponent = minorUnitExponent(currency);
  const digits = String(Math.abs(minor));
  const sign = minor < 0 ? '-' : '';
  if (exponent === 0) return sign + digits;
  const padded = digits.padStart(exponent + 1, '0');
  return `${sign}${padded.slice(0, -exponent)}.${padded.slice(-exponent)}`;
}

/**
 * Localised display ("$12.50", "12,50 €", "￥1,200"). The decimal string goes to Intl as text, which
 * formats it exactly (no division by 100 in floating point). Digits follow our exponent, so a currency
 * always shows as many decimals as it is charged in.
 */
export function formatMoney(minor: number, currency: string, locale = 'en-US'): string {
  const code = parseCurrency(currency);
  const exponent = minorUnitExponent(code);
  const formatter = new Intl.NumberFormat(locale, {
    style: 'currency',
    currency: code,
    minimumFractionDigits: exponent,
    maximumFractionDigits: exponent,
  });
  return formatter.format(fromMinor(minor, code) as `${number}`);
}
