import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { MAX_PROCESSOR_AMOUNT, SUPPORTED_CURRENCIES } from './currency';
import { MoneyError } from './errors';
import { basisPointsOf, checkoutTotal, maxAgreedTotal, MONEY_RULES, payoutShares, reviewWindowEndsAt, serviceFeeFor } from './fees';

function codeOf(fn: () => unknown): string | undefined {
  try {
    fn();
  } catch (error) {
    if (error instanceof MoneyError) return error.code;
    throw error;
  }
  return undefined;
}

// Expected values are worked by hand from the rates in MONEY_RULES (our own product choices).
describe('rates', () => {
  it('keeps the product rates in one place: 5 % service fee, 10 % commission, 7-day review window', () => {
    expect(MONEY_RULES.serviceFee.basisPoints).toBe(500);
    expect(MONEY_RULES.platformCommission.basisPoints).toBe(1000);
    expect(MONEY_RULES.reviewWindowDays).toBe(7);
    for (const code of SUPPORTED_CURRENCIES) expect(Number.isSafeInteger(MONEY_RULES.serviceFee.minimum[code])).toBe(true);
  });

  it('rounds basis points half up to a whole minor unit', () => {
    expect(basisPointsOf(1010, 500)).toBe(51); // 50.5
    expect(basisPointsOf(1009, 500)).toBe(50); // 50.45
    expect(basisPointsOf(1011, 500)).toBe(51); // 50.55
    expect(basisPointsOf(0, 500)).toBe(0);
  });
});

describe('serviceFeeFor and checkoutTotal', () => {
  it('charges 5 % of the agreed total, at least the minimum', () => {
    expect(serviceFeeFor(40_000, 'USD')).toBe(2000);
    expect(serviceFeeFor(1000, 'USD')).toBe(100); // 5 % would be 50: the minimum applies
    expect(serviceFeeFor(50_000, 'JPY')).toBe(2500);
    expect(serviceFeeFor(2000, 'JPY')).toBe(150);
  });

  it('adds the fee to the agreed total for checkout', () => {
    expect(checkoutTotal(40_000, 'usd')).toEqual({ currency: 'USD', agreed: 40_000, serviceFee: 2000, total: 42_000 });
  });

  it('refuses a checkout above the 8-digit processor limit (REFERENCES.md / Stripe docs: at most 8 digits)', () => {
    // 95 238 094 + 4 761 905 (4 761 904.7 rounded) = 99 999 999, the largest 8-digit amount.
    expect(maxAgreedTotal('USD')).toBe(95_238_094);
    expect(checkoutTotal(95_238_094, 'USD').total).toBe(MAX_PROCESSOR_AMOUNT);
    expect(codeOf(() => checkoutTotal(95_238_095, 'USD'))).toBe('amount_too_large');
  });

  it('refuses zero, negative and fractional agreed totals and unknown currencies', () => {
    expect(codeOf(() => checkoutTotal(0, 'USD'))).toBe('amount_too_small');
    expect(codeOf(() => checkoutTotal(-100, 'USD'))).toBe('invalid_amount');
    expect(codeOf(() => checkoutTotal(100.5, 'USD'))).toBe('invalid_amount');
    expect(codeOf(() => checkoutTotal(100, 'XYZ'))).toBe('invalid_currency');
  });

  it('always charges agreed + fee, with the fee at least the minimum and within half a unit of 5 %', () => {
    fc.assert(
      fc.property(fc.constantFrom(...SUPPORTED_CURRENCIES), fc.integer({ min: 1, max: 95_000_000 }), (code, agreed) => {
        const checkout = checkoutTotal(agreed, code);
        expect(Number.isSafeInteger(checkout.serviceFee)).toBe(true);
        expect(checkout.total).toBe(agreed + checkout.serviceFee);
        expect(checkout.serviceFee).toBeGreaterThanOrEqual(MONEY_RULES.serviceFee.minimum[code]);
        if (checkout.serviceFee > MONEY_RULES.serviceFee.minimum[code]) {
          expect(Math.abs(checkout.serviceFee * 20 - agreed)).toBeLessThanOrEqual(10);
        }
      }),
    );
  });
});

describe('payoutShares', () => {
  it('keeps 10 % of each share and pays out the rest', () => {
    expect(payoutShares({ drummer: 30_000, engineer: 10_000 }, 'USD')).toEqual({
      drummer: { gross: 30_000, commission: 3000, net: 27_000 },
      engineer: { gross: 10_000, commission: 1000, net: 9000 },
      platformCommission: 4000,
    });
  });

  it('takes the commission once on the whole and splits it by largest remainder', () => {
    // 19 134 × 10 % = 1913.4 → 1913; drummer 1913 × 12 345/19 134 = 1234.24, engineer 678.74:
    // floors 1234 + 678 = 1912, the engineer's larger remainder gets the last unit.
    expect(payoutShares({ drummer: 12_345, engineer: 6789 }, 'EUR')).toEqual({
      drummer: { gross: 12_345, commission: 1234, net: 11_111 },
      engineer: { gross: 6789, commission: 679, net: 6110 },
      platformCommission: 1913,
    });
  });

  it('pays a drummer recording in their own room alone', () => {
    expect(payoutShares({ drummer: 50_000, engineer: 0 }, 'JPY')).toEqual({
      drummer: { gross: 50_000, commission: 5000, net: 45_000 },
      engineer: { gross: 0, commission: 0, net: 0 },
      platformCommission: 5000,
    });
  });

  it('refuses an empty, negative or over-limit payout', () => {
    expect(codeOf(() => payoutShares({ drummer: 0, engineer: 0 }, 'USD'))).toBe('amount_too_small');
    expect(codeOf(() => payoutShares({ drummer: -1, engineer: 10 }, 'USD'))).toBe('invalid_amount');
    expect(codeOf(() => payoutShares({ drummer: MAX_PROCESSOR_AMOUNT, engineer: 1 }, 'USD'))).toBe('amount_too_large');
  });

  it('always has commission + net equal to the gross, in whole units, never below zero', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...SUPPORTED_CURRENCIES),
        fc.integer({ min: 0, max: 60_000_000 }),
        fc.integer({ min: 0, max: 39_999_999 }),
        (code, drummer, engineer) => {
          fc.pre(drummer + engineer > 0);
          const shares = payoutShares({ drummer, engineer }, code);
          for (const share of [shares.drummer, shares.engineer]) {
            expect(Number.isSafeInteger(share.commission) && Number.isSafeInteger(share.net)).toBe(true);
            expect(share.commission + share.net).toBe(share.gross);
            expect(share.net).toBeGreaterThanOrEqual(0);
          }
          expect(shares.drummer.commission + shares.engineer.commission).toBe(shares.platformCommission);
          expect(shares.drummer.net + shares.engineer.net + shares.platformCommission).toBe(drummer + engineer);
          expect(Math.abs(shares.platformCommission * 10 - (drummer + engineer))).toBeLessThanOrEqual(5);
        },
      ),
    );
  });
});

describe('review window', () => {
  it('ends seven days after the delivery', () => {
    expect(reviewWindowEndsAt(new Date('2025-03-01T10:00:00Z')).toISOString()).toBe('2025-03-08T10:00:00.000Z');
    expect(() => reviewWindowEndsAt(new Date('nope'))).toThrow(RangeError);
  });
});
