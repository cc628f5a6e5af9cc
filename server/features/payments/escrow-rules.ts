// The arithmetic of an escrow outcome, pure so it can be tested on its own: how much goes back to the
// songwriter, what each payee gets, what the platform keeps, and which charge each movement draws on.
import { MoneyError, payoutShares, splitByPercent, splitLargestRemainder, type PayeeShare } from '@shared/money';

export type OutcomePlan = {
  heldMinor: number;
  refundMinor: number;
  releasedMinor: number;
  drummer: PayeeShare;
  engineer: PayeeShare;
  commissionMinor: number;
};

const NOTHING: PayeeShare = { gross: 0, commission: 0, net: 0 };

/**
 * Divides what a booking holds: `refundMinor` back to the songwriter, the rest released to the payees in
 * proportion to their agreed shares (largest remainder), less the platform commission. The parts always
 * add up: refund + nets + commission = held.
 */
export function planOutcome(heldMinor: number, refundMinor: number, agreed: { drummer: number; engineer: number }, currency: string): OutcomePlan {
  if (!Number.isSafeInteger(refundMinor) || refundMinor < 0 || refundMinor > heldMinor) {
    throw new MoneyError('invalid_amount', `The refund must be between 0 and the ${heldMinor} minor units held`);
  }
  const releasedMinor = heldMinor - refundMinor;
  if (releasedMinor === 0) return { heldMinor, refundMinor, releasedMinor, drummer: NOTHING, engineer: NOTHING, commissionMinor: 0 };
  const [drummerGross, engineerGross] = splitLargestRemainder(releasedMinor, [agreed.drummer, agreed.engineer]);
  const shares = payoutShares({ drummer: drummerGross, engineer: engineerGross }, currency);
  return { heldMinor, refundMinor, releasedMinor, drummer: shares.drummer, engineer: shares.engineer, commissionMinor: shares.platformCommission };
}

/** The songwriter's part of a percentage split, by largest remainder against the payees' part. */
export function refundForPercent(heldMinor: number, songwriterPercent: number): number {
  if (heldMinor === 0) return 0;
  return splitByPercent(heldMinor, [songwriterPercent, Math.round((100 - songwriterPercent) * 100) / 100])[0];
}

export type ChargeRoom = { chargeId: string; roomMinor: number };

/**
 * Spreads one movement over the booking's charges, newest first (an add-on's charge before the booking's),
 * because the processor refuses to refund or transfer more than is left of a single charge.
 */
export function allocateAcrossCharges(amountMinor: number, charges: ChargeRoom[]): { chargeId: string; amountMinor: number }[] {
  const parts: { chargeId: string; amountMinor: number }[] = [];
  let left = amountMinor;
  for (const charge of charges) {
    if (left === 0) break;
    const take = Math.min(left, charge.roomMinor);
    if (take > 0) parts.push({ chargeId: charge.chargeId, amountMinor: take });
    left -= take;
  }
  if (left > 0) throw new MoneyError('amount_too_large', `The booking's charges have ${amountMinor - left} minor units left, ${amountMinor} are needed`);
  return parts;
}
