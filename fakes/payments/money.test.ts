import { describe, expect, it } from 'vitest';
import { DEFAULT_MINIMUM_AMOUNTS, checkAmountRange, checkMinimumCharge, formatAmount } from './money';
import { FakeApiError } from './errors';

function errorCode(run: () => void): string | undefined {
  try {
    run();
  } catch (error) {
    if (error instanceof FakeApiError) return error.body.code;
    throw error;
  }
  return undefined;
}

describe('amount rules', () => {
  it('formats two-decimal and zero-decimal currencies from the fake’s own list (REFERENCES.md, Stripe)', () => {
    expect(formatAmount(123_456, 'usd')).toBe('$1,234.56');
    expect(formatAmount(5_000, 'jpy')).toBe('¥5,000');
    expect(formatAmount(5_000, 'krw')).toBe('₩5,000');
    expect(formatAmount(50, 'eur')).toBe('€0.50');
  });

  it('allows at most eight digits (REFERENCES.md, Stripe)', () => {
    expect(errorCode(() => checkAmountRange(99_999_999, 'usd'))).toBeUndefined();
    expect(errorCode(() => checkAmountRange(100_000_000, 'usd'))).toBe('amount_too_large');
    expect(errorCode(() => checkAmountRange(0, 'usd'))).toBe('parameter_invalid_integer');
  });

  it('applies the minimum charge per currency: USD 0.50 (REFERENCES.md, Stripe) and the brief’s EUR/GBP 50', () => {
    for (const currency of ['usd', 'eur', 'gbp']) {
      expect(DEFAULT_MINIMUM_AMOUNTS[currency]).toBe(50);
      expect(errorCode(() => checkMinimumCharge(49, currency, DEFAULT_MINIMUM_AMOUNTS))).toBe('amount_too_small');
      expect(errorCode(() => checkMinimumCharge(50, currency, DEFAULT_MINIMUM_AMOUNTS))).toBeUndefined();
    }
    expect(errorCode(() => checkMinimumCharge(49, 'usd', { ...DEFAULT_MINIMUM_AMOUNTS, usd: 10 }))).toBeUndefined();
  });
});
