// Money as the API shows it (issue 4): escrow status per booking, payout accounts, the ledger and its
// reconciliation. Inputs are zod schemas shared by the forms and the routes.
import { z } from 'zod';

/** Shown wherever money is (issue 4, "Must be true"). */
export const MONEY_NOTICE =
  'Funds are held by the payment processor on the platform’s behalf under its terms. Kitlane is not a licensed escrow service. Taxes and contracts follow local law.';

export const checkoutSyncInputSchema = z.strictObject({ sessionId: z.string().regex(/^cs_[A-Za-z0-9_]+$/, 'A checkout session id').max(200) });
export type CheckoutSyncInput = z.infer<typeof checkoutSyncInputSchema>;

export const releaseInputSchema = z.strictObject({
  reason: z.string().trim().min(1, 'Say why the money is released').max(500).default('Delivery accepted'),
});
export type ReleaseInput = z.infer<typeof releaseInputSchema>;

export const refundInputSchema = z.strictObject({
  /** Without it, everything still held (and the service fee) goes back. */
  amountMinor: z.number().int('Whole minor units').positive('Above 0').max(99_999_999).optional(),
  reason: z.string().trim().min(1).max(500).default('Refund'),
});
export type RefundInput = z.infer<typeof refundInputSchema>;

export const splitInputSchema = z.union([
  z.strictObject({
    songwriterPercent: z.number().min(0, '0 to 100').max(100, '0 to 100').multipleOf(0.01, 'At most two decimals'),
    reason: z.string().trim().min(1).max(500).default('Split decided'),
  }),
  z.strictObject({
    refundMinor: z.number().int('Whole minor units').min(0).max(99_999_999),
    reason: z.string().trim().min(1).max(500).default('Split decided'),
  }),
]);
export type SplitInput = z.infer<typeof splitInputSchema>;

export type LedgerEntryView = { account: string; amount: number };
export type LedgerTransactionView = { id: string; memo: string; currency: string; externalId: string | null; createdAt: string; entries: LedgerEntryView[] };
export type LedgerBalance = { account: string; currency: string; balance: number };
export type BookingLedgerView = {
  bookingId: string;
  transactions: LedgerTransactionView[];
  balances: LedgerBalance[];
  escrowHeldMinor: number;
  currency: string | null;
};
export type LedgerTotalsView = { accounts: LedgerBalance[]; totals: { currency: string; sum: number }[] };

export type ReconciliationView = {
  ok: boolean;
  checkedAt: string;
  currencies: { currency: string; ledgerMinor: number; processorMinor: number; differenceMinor: number }[];
  transfers: { ledgerCount: number; processorCount: number; missingInLedger: string[]; missingAtProcessor: string[]; amountMismatch: string[] };
  refunds: { ledgerCount: number; processorCount: number; missingInLedger: string[]; missingAtProcessor: string[]; amountMismatch: string[] };
  /** Plain words, one line per difference; empty when everything agrees. */
  differences: string[];
};

export type PaymentView = {
  id: string;
  kind: 'booking' | 'add_on';
  status: 'creating' | 'open' | 'paid' | 'expired' | 'failed';
  workMinor: number;
  feeMinor: number;
  amountMinor: number;
  currency: string;
  lastError: string | null;
  createdAt: string;
  paidAt: string | null;
};

export type PayoutView = {
  id: string;
  kind: 'transfer' | 'refund';
  payee: { id: string; displayName: string } | null;
  amountMinor: number;
  currency: string;
  status: 'pending' | 'waiting_account' | 'done' | 'failed';
  reason: string;
  createdAt: string;
  doneAt: string | null;
};

export type ReceiptView = { id: string; title: string; amountMinor: number; currency: string; at: string; reference: string | null };

export type EscrowStage = 'awaiting_payment' | 'funded' | 'awaiting_release' | 'paid_out' | 'refunded' | 'cancelled' | 'settled';

export type BookingMoneyView = {
  bookingId: string;
  bookingStatus: string;
  stage: EscrowStage;
  currency: string;
  checkout: { agreedMinor: number; serviceFeeMinor: number; totalMinor: number };
  paidMinor: number;
  escrowHeldMinor: number;
  payments: PaymentView[];
  payouts: PayoutView[];
  receipts: ReceiptView[];
  autoAcceptAt: string | null;
  addOn: { needed: number; amountMinor: number; feeMinor: number };
  cancelRequestedBy: string[];
  can: { pay: boolean; payAddOn: boolean; cancel: boolean; release: boolean; refund: boolean; split: boolean };
  notice: string;
};

export type PayoutAccountView = {
  connected: boolean;
  payoutsEnabled: boolean;
  detailsSubmitted: boolean;
  /** Releases waiting for this account to be ready. */
  waiting: { bookingId: string; amountMinor: number; currency: string }[];
  notice: string;
};
