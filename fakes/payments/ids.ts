import { randomBytes } from 'node:crypto';

const ALPHABET = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz';

/** Ids shaped like the hosted API's: a type prefix and a random base-62 tail. */
export function newId(prefix: string, length = 24): string {
  const bytes = randomBytes(length);
  let tail = '';
  // 62 does not divide 256, so the modulo has a tiny bias; irrelevant for ids that only need uniqueness.
  for (const byte of bytes) tail += ALPHABET[byte % ALPHABET.length];
  return `${prefix}${tail}`;
}

export const ID_PREFIX = {
  checkoutSession: 'cs_test_',
  paymentIntent: 'pi_',
  charge: 'ch_',
  refund: 're_',
  transfer: 'tr_',
  transferReversal: 'trr_',
  account: 'acct_',
  event: 'evt_',
  balanceTransaction: 'txn_',
  paymentMethod: 'pm_',
  lineItem: 'li_',
  price: 'price_',
  product: 'prod_',
  request: 'req_',
  delivery: 'whdel_',
} as const;

/** Seconds since the epoch, the unit of every `created` field. */
export function unixNow(): number {
  return Math.floor(Date.now() / 1000);
}
