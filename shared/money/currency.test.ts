import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  formatMoney,
  fromMinor,
  MAX_PROCESSOR_AMOUNT,
  minorUnitExponent,
  parseCurrency,
  SUPPORTED_CURRENCIES,
  toMinor,
  ZERO_DECIMAL_CURRENCIES,
} from './currency';
import { MoneyError } from './errors';

const ZERO_DECIMAL_SUPPORTED = SUPPORTED_CURRENCIES.filter((code) => ZERO_DECIMAL_CURRENCIES.includes(code));

function codeOf(fn: () => unknown): string | undefined {
  try {
    fn();
  } catch (error) {
    if (error instanceof MoneyError) return error.code;
    throw error;
  }
  return undefined;
}

describe('currencies', () => {
  it('treats JPY and KRW as zero-decimal and the other supported currencies as two-decimal (REFERENCES.md / Stripe docs, zero-decimal currencies)', () => {
    expect(ZERO_DECIMAL_SUPPORTED).toEqual(['JPY', 'KRW']);
    expect(minorUnitExponent('JPY')).toBe(0);
    expect(minorUnitExponent('krw')).toBe(0);
    for (const code of ['USD', 'EUR', 'GBP', 'CAD', 'AUD', 'SEK', 'NOK', 'DKK', 'CHF', 'NZD']) {
      expect(minorUnitExponent(code)).toBe(2);
    }
  });

  it('holds the whole Stripe zero-decimal list from REFERENCES.md', () => {
    expect([...ZERO_DECIMAL_CURRENCIES].sort()).toEqual(
      'BIF CLP DJF GNF JPY KMF KRW MGA PYG RWF UGX VND VUV XAF XOF XPF'.split(' '),
    );
  });

  it('normalises lower-case codes and refuses unsupported ones', () => {
    expect(parseCurrency(' usd ')).toBe('USD');
    expect(codeOf(() => parseCurrency('XYZ'))).toBe('invalid_currency');
    expect(codeOf(() => minorUnitExponent('BIF'))).toBe('invalid_currency');
  });
});

describe('toMinor', () => {
  it('reads USD 10.00 as 1000 and JPY 1200 as 1200 (Stripe docs, minor units in API amounts)', () => {
    expect(toMinor('10.00', 'USD')).toBe(1000);
    expect(toMinor('1200', 'JPY')).toBe(1200);
  });

  it('parses decimal text exactly, with sign, short fractions and trailing zeros', () => {
    expect(toMinor('12.5', 'EUR')).toBe(1250);
    expect(toMinor('-3.10', 'GBP')).toBe(-310);
    expect(toMinor('.05', 'USD')).toBe(5);
    expect(toMinor('12.500', 'USD')).toBe(1250);
    expect(toMinor('1200.00', 'JPY')).toBe(1200);
    expect(toMinor('-0.00', 'USD')).toBe(0);
    expect(Object.is(toMinor('-0', 'USD'), 0)).toBe(true);
  });

  it('reads numbers as the decimal they print as, so 0.1 + 0.2 is refused rather than rounded', () => {
    expect(toMinor(19.99, 'USD')).toBe(1999);
    expect(toMinor(0.29, 'USD')).toBe(29); // 0.29 * 100 is 28.999999999999996 in floating point
    expect(toMinor(1e3, 'JPY')).toBe(1000);
    expect(codeOf(() => toMinor(0.1 + 0.2, 'USD'))).toBe('too_many_decimals');
    expect(codeOf(() => toMinor(Number.NaN, 'USD'))).toBe('invalid_amount');
  });

  it('refuses more decimals than the currency has instead of rounding', () => {
    expect(codeOf(() => toMinor('12.345', 'USD'))).toBe('too_many_decimals');
    expect(codeOf(() => toMinor('1.5', 'JPY'))).toBe('too_many_decimals');
  });

  it('refuses thousands separators, symbols, blanks and values beyond exact integers', () => {
    for (const text of ['1,234.00', '$5', '', '.', '1.2.3', '1e3', ' - 1']) {
      expect(codeOf(() => toMinor(text, 'USD'))).toBe('invalid_amount');
    }
    expect(codeOf(() => toMinor('90071992547409.92', 'USD'))).toBe('amount_too_large');
  });
});

describe('fromMinor and formatMoney', () => {
  it('writes minor units back as plain decimal text', () => {
    expect(fromMinor(1250, 'USD')).toBe('12.50');
    expect(fromMinor(-5, 'USD')).toBe('-0.05');
    expect(fromMinor(0, 'EUR')).toBe('0.00');
    expect(fromMinor(1200, 'JPY')).toBe('1200');
    expect(codeOf(() => fromMinor(1.5, 'USD'))).toBe('invalid_amount');
  });

  it('formats with the locale, showing as many decimals as the currency is charged in', () => {
    expect(formatMoney(1250, 'USD')).toBe('$12.50');
    expect(formatMoney(123450, 'EUR', 'de-DE')).toBe('1.234,50\u00a0€');
    expect(formatMoney(1200, 'JPY', 'en-US')).toBe('¥1,200');
    expect(formatMoney(-5, 'GBP', 'en-GB')).toBe('-£0.05');
  });

  it('formats the processor maximum exactly (Stripe docs: 99999999 is USD 999,999.99)', () => {
    expect(formatMoney(MAX_PROCESSOR_AMOUNT, 'USD')).toBe('$999,999.99');
    expect(formatMoney(Number.MAX_SAFE_INTEGER, 'USD')).toBe('$90,071,992,547,409.91');
  });

  it('round-trips every safe integer through text in every supported currency', () => {
    fc.assert(
      fc.property(fc.maxSafeInteger(), fc.constantFrom(...SUPPORTED_CURRENCIES), (minor, code) => {
        expect(toMinor(fromMinor(minor, code), code)).toBe(minor);
      }),
    );
  });

  it('never gives a zero-decimal currency a fractional amount', () => {
    fc.assert(
      fc.property(fc.integer({ min: -MAX_PROCESSOR_AMOUNT, max: MAX_PROCESSOR_AMOUNT }), fc.constantFrom(...ZERO_DECIMAL_SUPPORTED), (minor, code) => {
        expect(fromMinor(minor, code)).toMatch(/^-?\d+$/);
        expect(formatMoney(minor, code, 'en-US')).not.toContain('.');
      }),
    );
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 1_000_000 }), fc.integer({ min: 1, max: 99 }), fc.constantFrom(...ZERO_DECIMAL_SUPPORTED), (whole, cents, code) => {
        const text = `${whole}.${String(cents).padStart(2, '0')}`;
        expect(codeOf(() => toMinor(text, code))).toBe('too_many_decimals');
      }),
    );
  });
});
