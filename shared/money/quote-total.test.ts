import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { MAX_PROCESSOR_AMOUNT, SUPPORTED_CURRENCIES } from './currency';
import { MoneyError } from './errors';
import { checkoutTotal, maxAgreedTotal } from './fees';
import { lineTotal, QUOTE_LINE_KINDS, quoteLineItemInputSchema, quoteLineItemsInputSchema, quoteTotal, type QuoteLineItemInput } from './quote-total';

function codeOf(fn: () => unknown): string | undefined {
  try {
    fn();
  } catch (error) {
    if (error instanceof MoneyError) return error.code;
    throw error;
  }
  return undefined;
}

const line = (kind: QuoteLineItemInput['kind'], unitAmount: number, quantity = 1): QuoteLineItemInput => ({ kind, label: kind, unitAmount, quantity });

describe('quoteTotal', () => {
  it('adds per-song fees, the package, rush and extra revisions', () => {
    const items = [line('per_song', 15_000, 3), line('package', 20_000), line('rush', 5000), line('extra_revision', 2500, 2)];
    expect(quoteTotal(items, 'USD')).toBe(45_000 + 20_000 + 5000 + 5000);
  });

  it('refuses an empty quote, bad quantities and negative or fractional prices', () => {
    expect(codeOf(() => quoteTotal([], 'USD'))).toBe('invalid_line_item');
    expect(codeOf(() => quoteTotal([line('other', 100, 0)], 'USD'))).toBe('invalid_line_item');
    expect(codeOf(() => quoteTotal([line('other', 100, 1.5)], 'USD'))).toBe('invalid_line_item');
    expect(codeOf(() => quoteTotal([line('other', -1)], 'USD'))).toBe('invalid_line_item');
    expect(codeOf(() => quoteTotal([line('other', 99.5)], 'USD'))).toBe('invalid_line_item');
    expect(codeOf(() => quoteTotal([{ ...line('other', 1), kind: 'discount' as never }], 'USD'))).toBe('invalid_line_item');
  });

  it('refuses a line or a quote whose checkout would pass the 8-digit limit (REFERENCES.md / Stripe docs)', () => {
    expect(codeOf(() => lineTotal(line('per_song', 1_000_000, 100)))).toBe('amount_too_large');
    expect(codeOf(() => lineTotal(line('per_song', MAX_PROCESSOR_AMOUNT, 999)))).toBe('amount_too_large');
    const atLimit = maxAgreedTotal('USD');
    expect(quoteTotal([line('package', atLimit)], 'USD')).toBe(atLimit);
    expect(codeOf(() => quoteTotal([line('package', atLimit), line('other', 1)], 'USD'))).toBe('amount_too_large');
  });

  it('always equals the sum of unit amount × quantity, and every accepted quote can be checked out', () => {
    const itemArb = fc.record({
      kind: fc.constantFrom(...QUOTE_LINE_KINDS),
      label: fc.constant('line'),
      unitAmount: fc.integer({ min: 0, max: 2_000_000 }),
      quantity: fc.integer({ min: 1, max: 20 }),
    });
    fc.assert(
      fc.property(fc.array(itemArb, { minLength: 1, maxLength: 10 }), fc.constantFrom(...SUPPORTED_CURRENCIES), (items, code) => {
        const expected = items.reduce((sum, item) => sum + item.unitAmount * item.quantity, 0);
        let total: number;
        try {
          total = quoteTotal(items, code);
        } catch (error) {
          expect((error as MoneyError).code).toBe('amount_too_large');
          expect(expected).toBeGreaterThan(maxAgreedTotal(code));
          return;
        }
        expect(total).toBe(expected);
        if (total > 0) expect(checkoutTotal(total, code).total).toBeLessThanOrEqual(MAX_PROCESSOR_AMOUNT);
      }),
    );
  });
});

describe('quoteLineItemInputSchema', () => {
  it('accepts a well-formed line and trims its label', () => {
    expect(quoteLineItemInputSchema.parse({ kind: 'rush', label: '  48-hour turnaround ', unitAmount: 5000, quantity: 1 })).toEqual({
      kind: 'rush',
      label: '48-hour turnaround',
      unitAmount: 5000,
      quantity: 1,
    });
  });

  it('names the field that is wrong', () => {
    const result = quoteLineItemInputSchema.safeParse({ kind: 'per_song', label: '', unitAmount: 12.5, quantity: 0 });
    expect(result.success).toBe(false);
    const fields = result.error?.issues.map((issue) => issue.path.join('.')).sort();
    expect(fields).toEqual(['label', 'quantity', 'unitAmount']);
    expect(quoteLineItemsInputSchema.safeParse([]).success).toBe(false);
  });
});
