// Disputes (issue 4): either party of a funded booking opens one; only an admin settles it with one of
// three outcomes. Used by the forms (zodResolver) and the routes, so every rule lives here once.
import { z } from 'zod';
import type { BookingStatus } from './bookings';
import type { PayeeShare } from '../money/fees';

export const DISPUTE_REASONS = ['not_delivered', 'not_as_briefed', 'technical_problems', 'payment_problem', 'other'] as const;
export type DisputeReason = (typeof DISPUTE_REASONS)[number];

export const DISPUTE_REASON_LABELS: Record<DisputeReason, string> = {
  not_delivered: 'Not delivered',
  not_as_briefed: 'Not as briefed',
  technical_problems: 'Technical problems with the stems',
  payment_problem: 'Payment problem',
  other: 'Something else',
};

/**
 * Where a dispute can be opened: money is held in escrow. `accepted` is left out on purpose: from there
 * the release has already moved the money out of escrow to the payees.
 */
export const DISPUTABLE_STATUSES = ['funded', 'recording', 'delivered', 'changes_requested'] as const satisfies readonly BookingStatus[];

export const DISPUTE_STATUSES = ['open', 'settled'] as const;
export type DisputeStatus = (typeof DISPUTE_STATUSES)[number];

export const DISPUTE_OUTCOMES = ['release', 'refund', 'split'] as const;
export type DisputeOutcome = (typeof DISPUTE_OUTCOMES)[number];

export const DISPUTE_OUTCOME_LABELS: Record<DisputeOutcome, string> = {
  release: 'Released to the payees',
  refund: 'Refunded to the songwriter',
  split: 'Split between the two sides',
};

export const openDisputeInputSchema = z.strictObject({
  reason: z.enum(DISPUTE_REASONS, 'Choose a reason'),
  text: z.string().trim().min(20, 'Tell the admin what happened in at least 20 characters').max(4000, 'At most 4000 characters'),
});
export type OpenDisputeInput = z.infer<typeof openDisputeInputSchema>;

const note = z.string().trim().min(10, 'Write the decision in at least 10 characters; both sides read it').max(2000, 'At most 2000 characters');

/**
 * An admin's outcome. A split names either the songwriter's percentage of what escrow holds or the exact
 * amount refunded to them; the rest goes to the payees. `expectedHeldMinor` is what the confirmation step
 * showed: if the held amount changed meanwhile, the decision is refused instead of applied to other money.
 */
export const settleDisputeInputSchema = z.discriminatedUnion('outcome', [
  z.strictObject({ outcome: z.literal('release'), note, expectedHeldMinor: z.number().int().min(0).optional() }),
  z.strictObject({ outcome: z.literal('refund'), note, expectedHeldMinor: z.number().int().min(0).optional() }),
  z.strictObject({
    outcome: z.literal('split'),
    note,
    expectedHeldMinor: z.number().int().min(0).optional(),
    songwriterPercent: z.number().min(0, '0 to 100').max(100, '0 to 100').multipleOf(0.01, 'At most two decimals').optional(),
    refundMinor: z.number().int('Whole minor units').min(0, 'At least 0').max(99_999_999).optional(),
  }),
]).superRefine((value, ctx) => {
  if (value.outcome !== 'split') return;
  const given = Number(value.songwriterPercent !== undefined) + Number(value.refundMinor !== undefined);
  if (given !== 1) ctx.addIssue({ code: 'custom', path: ['songwriterPercent'], message: 'Give either a percentage or an amount for the songwriter' });
});
export type SettleDisputeInput = z.infer<typeof settleDisputeInputSchema>;

/** The same choice without the note: the confirmation step asks the server for the exact amounts. */
export const previewSettlementInputSchema = z.discriminatedUnion('outcome', [
  z.strictObject({ outcome: z.literal('release') }),
  z.strictObject({ outcome: z.literal('refund') }),
  z.strictObject({
    outcome: z.literal('split'),
    songwriterPercent: z.number().min(0, '0 to 100').max(100, '0 to 100').multipleOf(0.01, 'At most two decimals').optional(),
    refundMinor: z.number().int('Whole minor units').min(0, 'At least 0').max(99_999_999).optional(),
  }),
]).superRefine((value, ctx) => {
  if (value.outcome !== 'split') return;
  const given = Number(value.songwriterPercent !== undefined) + Number(value.refundMinor !== undefined);
  if (given !== 1) ctx.addIssue({ code: 'custom', path: ['songwriterPercent'], message: 'Give either a percentage or an amount for the songwriter' });
});
export type PreviewSettlementInput = z.infer<typeof previewSettlementInputSchema>;

export const disputesQuerySchema = z.strictObject({
  status: z.enum(DISPUTE_STATUSES).optional(),
});
export type DisputesQuery = z.infer<typeof disputesQuerySchema>;

export type SettlementAmounts = {
  currency: string;
  /** What escrow holds for the booking's work when the decision is taken. */
  heldMinor: number;
  /** Goes back to the songwriter out of escrow. */
  songwriterMinor: number;
  /** The service fee returned with a full refund. */
  serviceFeeRefundMinor: number;
  /** Released to the payees (drummer and engineer together), before the platform commission. */
  payeesMinor: number;
};

export type DisputeView = {
  id: string;
  bookingId: string;
  songTitle: string;
  status: DisputeStatus;
  /** Decided, and the money is being moved: no second decision until it is settled. */
  settling: boolean;
  reason: DisputeReason;
  text: string;
  openedBy: { id: string; displayName: string; role: 'songwriter' | 'drummer' | 'engineer' };
  /** What the booking was doing when the dispute froze it. */
  bookingStatusBefore: BookingStatus;
  outcome: DisputeOutcome | null;
  amounts: SettlementAmounts | null;
  decisionNote: string | null;
  createdAt: string;
  settledAt: string | null;
};

export type DisputeList = { items: DisputeView[]; total: number };

/** The confirmation step: exactly what each side gets if the admin confirms. */
export type SettlementPreview = {
  outcome: DisputeOutcome;
  currency: string;
  heldMinor: number;
  /** Back to the songwriter out of escrow. */
  songwriterMinor: number;
  /** A full refund also returns the service fee the songwriter paid on top (not part of escrow). */
  serviceFeeRefundMinor: number;
  /** Released to the payees before the platform commission. */
  payeesMinor: number;
  drummer: PayeeShare;
  engineer: PayeeShare | null;
  commissionMinor: number;
  /** The percentage asked for, when the split was given as one. */
  songwriterPercent: number | null;
};
