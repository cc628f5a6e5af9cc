// The exact amounts of a dispute outcome, computed the same way the escrow service moves them
// (server/features/payments/escrow-rules.ts), so the confirmation step shows what will happen to the unit.
import { planOutcome, refundForPercent } from '../payments/escrow-rules';
import { AppError } from '../../http/app-error';
import type { PreviewSettlementInput, SettlementPreview } from '@shared/schemas/disputes';

export type SettlementPlan = SettlementPreview;

export function refundOf(heldMinor: number, input: PreviewSettlementInput): number {
  if (input.outcome === 'release') return 0;
  if (input.outcome === 'refund') return heldMinor;
  if (input.songwriterPercent !== undefined) return refundForPercent(heldMinor, input.songwriterPercent);
  const refundMinor = input.refundMinor ?? 0;
  if (refundMinor > heldMinor) {
    throw new AppError('split_too_large', `Escrow holds ${heldMinor} minor units; the songwriter cannot get more`, 400, { refundMinor: `At most ${heldMinor}` });
  }
  return refundMinor;
}

export function planSettlement(
  booking: { drummerShareMinor: number; engineerShareMinor: number; engineerId: string | null; currency: string },
  heldMinor: number,
  input: PreviewSettlementInput,
  /** The service fee still kept for this booking: a full refund returns it. */
  feesKeptMinor = 0,
): SettlementPlan {
  const songwriterMinor = refundOf(heldMinor, input);
  const plan = planOutcome(heldMinor, songwriterMinor, { drummer: booking.drummerShareMinor, engineer: booking.engineerShareMinor }, booking.currency);
  return {
    outcome: input.outcome,
    currency: booking.currency,
    heldMinor,
    songwriterMinor: plan.refundMinor,
    serviceFeeRefundMinor: input.outcome === 'refund' ? feesKeptMinor : 0,
    payeesMinor: plan.releasedMinor,
    drummer: plan.drummer,
    engineer: booking.engineerId ? plan.engineer : null,
    commissionMinor: plan.commissionMinor,
    songwriterPercent: input.outcome === 'split' ? (input.songwriterPercent ?? null) : null,
  };
}
