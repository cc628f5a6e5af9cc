// Kitlane's money rates, all in one place (DESIGN.md, Money: "Rates live in one config module").
// Every number in MONEY_RULES is our own product choice, not a published fact: change it here and
// every screen and ledger entry follows.
import { MAX_PROCESSOR_AMOUNT, parseCurrency, PROCESSOR_MINIMUM_CHARGE, type CurrencyCode } from './currency';
import { assertNonNegativeInteger, MoneyError } from './errors';
import { splitLargestRemainder } from './split';

export const MONEY_RULES = {
  /** Added to the songwriter's checkout: 5 % of the agreed total, at least the minimum below. */
  serviceFee: {
    basisPoints: 500,
    /**
     * Minimum fee in minor units, about one US dollar in each currency (our choice; rounded to
     * amounts that read naturally in each currency, not tracked against exchange rates).
     */
    minimum: {
      USD: 100,
      EUR: 100,
      GBP: 100,
      CAD: 100,
      AUD: 150,
      NZD: 150,
      CHF: 100,
      JPY: 150,
      KRW: 1500,
      SEK: 1000,
      NOK: 1000,
      DKK: 700,
    } satisfies Record<CurrencyCode, number>,
  },
  /** Kept from each payee's share on release: 10 % of what the booking paid out. */
  platformCommission: { basisPoints: 1000 },
  /** Days a songwriter has to answer a delivery before it is accepted and released automatically. */
  reviewWindowDays: 7,
} as const;

const BASIS_POINTS_PER_WHOLE = 10_000n;

/**
 * `amount × basisPoints / 10 000`, rounded half up to a whole minor unit. Half up is our choice: on a
 * tie the platform's fee goes up by one minor unit, never by more.
 */
export function basisPointsOf(amount: number, basisPoints: number): number {
  assertNonNegativeInteger(amount, 'Amount');
  assertNonNegativeInteger(basisPoints, 'Rate in basis points');
  const scaled = BigInt(amount) * BigInt(basisPoints);
  return Number((scaled * 2n + BASIS_POINTS_PER_WHOLE) / (2n * BASIS_POINTS_PER_WHOLE));
}

function assertPositiveTotal(total: number, what: string): void {
  assertNonNegativeInteger(total, what);
  if (total === 0) throw new MoneyError('amount_too_small', `${what} must be above 0`);
}

/** The songwriter's service fee on an agreed quote total, in the same currency's minor units. */
export function serviceFeeFor(total: number, currency: string): number {
  const code = parseCurrency(currency);
  assertPositiveTotal(total, 'The agreed total');
  const { basisPoints, minimum } = MONEY_RULES.serviceFee;
  return Math.max(minimum[code], basisPointsOf(total, basisPoints));
}

export type CheckoutTotal = { currency: CurrencyCode; agreed: number; serviceFee: number; total: number };

/**
 * What the songwriter pays at checkout: the agreed quote total plus the service fee. Refused when the
 * sum is outside what the processor can charge in one payment.
 */
export function checkoutTotal(agreedTotal: number, currency: string): CheckoutTotal {
  const code = parseCurrency(currency);
  const serviceFee = serviceFeeFor(agreedTotal, code);
  const total = agreedTotal + serviceFee;
  if (total > MAX_PROCESSOR_AMOUNT) {
    throw new MoneyError(
      'amount_too_large',
      `The checkout total (quote plus service fee) would be ${total} minor units; one payment can be at most ${MAX_PROCESSOR_AMOUNT}`,
    );
  }
  if (total < PROCESSOR_MINIMUM_CHARGE[code]) {
    throw new MoneyError('amount_too_small', `One payment must be at least ${PROCESSOR_MINIMUM_CHARGE[code]} minor units of ${code}`);
  }
  return { currency: code, agreed: agreedTotal, serviceFee, total };
}

/**
 * The largest agreed total whose checkout total still fits in one processor payment. Found by
 * bisection over whole minor units because the fee's rounding and minimum make a closed form fiddly.
 */
export function maxAgreedTotal(currency: string): number {
  const code = parseCurrency(currency);
  const fits = (agreed: number) => agreed + serviceFeeFor(agreed, code) <= MAX_PROCESSOR_AMOUNT;
  let low = 1;
  let high = MAX_PROCESSOR_AMOUNT;
  while (low < high) {
    const middle = Math.ceil((low + high) / 2);
    if (fits(middle)) low = middle;
    else high = middle - 1;
  }
  return low;
}

export type PayeeShare = { gross: number; commission: number; net: number };
export type PayoutShares = { drummer: PayeeShare; engineer: PayeeShare; platformCommission: number };

/**
 * Splits a released booking between its payees. The platform commission is taken once on the whole
 * (so it is the same however the work was shared) and divided between the payees by largest
 * remainder in proportion to their gross, so commissions + nets always equal the gross exactly.
 * An engineer share of 0 means the drummer recorded in their own room.
 */
export function payoutShares(agreed: { drummer: number; engineer: number }, currency: string): PayoutShares {
  parseCurrency(currency);
  assertNonNegativeInteger(agreed.drummer, "The drummer's share");
  assertNonNegativeInteger(agreed.engineer, "The engineer's share");
  const gross = agreed.drummer + agreed.engineer;
  assertPositiveTotal(gross, 'The amount to pay out');
  if (gross > MAX_PROCESSOR_AMOUNT) {
    throw new MoneyError('amount_too_large', `A booking pays out at most ${MAX_PROCESSOR_AMOUNT} minor units, got ${gross}`);
  }
  const platformCommission = basisPointsOf(gross, MONEY_RULES.platformCommission.basisPoints);
  const [drummerCommission, engineerCommission] = splitLargestRemainder(platformCommission, [agreed.drummer, agreed.engineer]);
  return {
    drummer: { gross: agreed.drummer, commission: drummerCommission, net: agreed.drummer - drummerCommission },
    engineer: { gross: agreed.engineer, commission: engineerCommission, net: agreed.engineer - engineerCommission },
    platformCommission,
  };
}

const MS_PER_DAY = 24 * 60 * 60 * 1000;

/** When an unanswered delivery is accepted automatically (an open dispute stops this clock). */
export function reviewWindowEndsAt(deliveredAt: Date, days: number = MONEY_RULES.reviewWindowDays): Date {
  if (Number.isNaN(deliveredAt.getTime())) throw new RangeError('deliveredAt is not a valid date');
  return new Date(deliveredAt.getTime() + days * MS_PER_DAY);
}
