// A quote's price is the sum of its line items (DESIGN.md, Money: per-song fee, room/package fee, rush
// fee, extra-revision price). Totals are checked against what one processor payment can hold before a
// songwriter ever gets to checkout.
import { z } from 'zod';
import { MAX_PROCESSOR_AMOUNT, parseCurrency } from './currency';
import { MoneyError } from './errors';
import { maxAgreedTotal } from './fees';

export const QUOTE_LINE_KINDS = ['per_song', 'package', 'rush', 'extra_revision', 'other'] as const;
export type QuoteLineKind = (typeof QUOTE_LINE_KINDS)[number];

/** Our own caps: generous for a drum session, small enough that a typo (quantity 1000) is caught. */
export const MAX_LINE_QUANTITY = 999;
export const MAX_LINE_ITEMS = 50;
export const MAX_LABEL_LENGTH = 120;

export const quoteLineItemInputSchema = z.object({
  kind: z.enum(QUOTE_LINE_KINDS),
  label: z.string().trim().min(1, 'Give the line a short label').max(MAX_LABEL_LENGTH),
  unitAmount: z.int().min(0, 'A price cannot be negative').max(MAX_PROCESSOR_AMOUNT, 'That price is above what one payment can hold'),
  quantity: z.int().min(1, 'At least 1').max(MAX_LINE_QUANTITY),
});
export type QuoteLineItemInput = z.infer<typeof quoteLineItemInputSchema>;

export const quoteLineItemsInputSchema = z.array(quoteLineItemInputSchema).min(1, 'A quote needs at least one line').max(MAX_LINE_ITEMS);

function invalidLine(index: number, message: string): MoneyError {
  return new MoneyError('invalid_line_item', `Line ${index + 1}: ${message}`);
}

function checkLine(item: QuoteLineItemInput, index: number): void {
  if (!QUOTE_LINE_KINDS.includes(item.kind)) throw invalidLine(index, `unknown kind "${String(item.kind)}"`);
  if (!Number.isSafeInteger(item.unitAmount) || item.unitAmount < 0) {
    throw invalidLine(index, `unit amount must be a whole number of minor units of at least 0, got ${String(item.unitAmount)}`);
  }
  if (!Number.isSafeInteger(item.quantity) || item.quantity < 1 || item.quantity > MAX_LINE_QUANTITY) {
    throw invalidLine(index, `quantity must be a whole number from 1 to ${MAX_LINE_QUANTITY}, got ${String(item.quantity)}`);
  }
}

/** One line's amount: unit amount × quantity, refused above one payment's limit. */
export function lineTotal(item: QuoteLineItemInput, index = 0): number {
  checkLine(item, index);
  // Both factors are checked safe integers; the product is compared before it could lose precision.
  if (item.unitAmount > Math.floor(MAX_PROCESSOR_AMOUNT / item.quantity)) {
    throw new MoneyError('amount_too_large', `Line ${index + 1} comes to more than one payment can hold (${MAX_PROCESSOR_AMOUNT} minor units)`);
  }
  return item.unitAmount * item.quantity;
}

/**
 * The agreed total of a quote in minor units. Refused when the songwriter's checkout (this total plus
 * the service fee) would not fit in one processor payment, so such a quote can never be sent.
 */
export function quoteTotal(items: QuoteLineItemInput[], currency: string): number {
  const code = parseCurrency(currency);
  if (!Array.isArray(items) || items.length === 0) throw new MoneyError('invalid_line_item', 'A quote needs at least one line');
  if (items.length > MAX_LINE_ITEMS) throw new MoneyError('invalid_line_item', `A quote has at most ${MAX_LINE_ITEMS} lines`);
  const limit = maxAgreedTotal(code);
  let total = 0;
  items.forEach((item, index) => {
    total += lineTotal(item, index);
    // Checked after every line: with each line below 10^8, the running sum stays far from 2^53.
    if (total > limit) {
      throw new MoneyError(
        'amount_too_large',
        `The quote comes to more than ${limit} minor units of ${code}; with the service fee that is above one payment's limit`,
      );
    }
  });
  return total;
}
