// The admin desk (issue 4): accounts, bookings search, the audit log. Admin-only routes parse these.
import { z } from 'zod';
import { BOOKING_STATUSES, type BookingStatus, type BookingView } from './bookings';
import type { DeliveryCheckReport } from './delivery-check';
import type { DisputeView } from './disputes';
import type { BookingLedgerView } from './payments';

const page = {
  limit: z.coerce.number().int().min(1).max(200).default(50),
  offset: z.coerce.number().int().min(0).max(1_000_000).default(0),
};

export const adminAccountsQuerySchema = z.strictObject({
  q: z.string().trim().max(200).optional(),
  ...page,
});
export type AdminAccountsQuery = z.infer<typeof adminAccountsQuerySchema>;

export const adminBookingsQuerySchema = z.strictObject({
  q: z.string().trim().max(200).optional(),
  status: z.enum(BOOKING_STATUSES).optional(),
  ...page,
});
export type AdminBookingsQuery = z.infer<typeof adminBookingsQuerySchema>;

export const auditQuerySchema = z.strictObject({
  ...page,
});
export type AuditQuery = z.infer<typeof auditQuerySchema>;

export const accountActionInputSchema = z.strictObject({
  reason: z.string().trim().min(5, 'Say why in at least 5 characters').max(500, 'At most 500 characters'),
});
export type AccountActionInput = z.infer<typeof accountActionInputSchema>;

export const AUDIT_ACTIONS = ['settle', 'release', 'refund', 'split', 'disable', 'enable', 'grant'] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

export const AUDIT_ACTION_LABELS: Record<AuditAction, string> = {
  settle: 'Settled a dispute',
  release: 'Released escrow',
  refund: 'Refunded escrow',
  split: 'Split escrow',
  disable: 'Disabled an account',
  enable: 'Enabled an account',
  grant: 'Granted admin',
};

export type AuditAmounts = { currency: string; songwriterMinor?: number; payeesMinor?: number; heldMinor?: number };

export type AuditEntryView = {
  id: string;
  actor: { id: string | null; displayName: string };
  action: AuditAction;
  targetType: 'booking' | 'dispute' | 'user';
  targetId: string;
  targetLabel: string;
  amounts: AuditAmounts | null;
  note: string;
  createdAt: string;
};
export type AuditList = { items: AuditEntryView[]; total: number };

export type AdminAccountView = {
  id: string;
  email: string;
  displayName: string;
  roles: string[];
  emailVerified: boolean;
  disabledAt: string | null;
  createdAt: string;
  bookings: number;
};
export type AdminAccountList = { items: AdminAccountView[]; total: number };

export type AdminBookingView = {
  id: string;
  songTitle: string;
  status: BookingStatus;
  totalMinor: number;
  currency: string;
  songwriter: string;
  drummer: string;
  engineer: string | null;
  openDisputeId: string | null;
  createdAt: string;
  updatedAt: string;
};
export type AdminBookingList = { items: AdminBookingView[]; total: number };

/** One message of the booking's conversations, as the dispute case file shows it. */
export type CaseMessage = {
  id: string;
  /** The conversation before hiring (about the brief) or after (about the booking). */
  thread: 'brief' | 'booking';
  senderId: string;
  senderName: string;
  body: string;
  attachmentName: string | null;
  createdAt: string;
};

export type CaseDelivery = {
  id: string;
  number: number | null;
  status: string | null;
  createdAt: string | null;
  report: DeliveryCheckReport | null;
};

/** Everything an admin needs to decide a dispute, in one answer. */
export type DisputeCaseView = {
  dispute: DisputeView;
  booking: BookingView;
  messages: CaseMessage[];
  /** `available: false` when this build has no delivery tables yet; the page says "no delivery yet" either way. */
  deliveries: { available: boolean; items: CaseDelivery[] };
  ledger: BookingLedgerView;
  audit: AuditEntryView[];
  /** Earlier disputes on the same booking, newest first. */
  earlier: DisputeView[];
};
