// Bookings as the API shows them. A booking is made from an accepted quote and carries a frozen copy of
// the agreed terms; its status words are DESIGN.md's lifecycle.
import { z } from 'zod';
import type { QuoteLineItemView, RightsTerms } from './quotes';

export const BOOKING_STATUSES = [
  'awaiting_payment',
  'funded',
  'recording',
  'delivered',
  'changes_requested',
  'accepted',
  'paid_out',
  'disputed',
  'settled',
  'cancelled',
] as const;
export type BookingStatus = (typeof BOOKING_STATUSES)[number];

export const BOOKING_STATUS_LABELS: Record<BookingStatus, string> = {
  awaiting_payment: 'Awaiting payment',
  funded: 'Funded',
  recording: 'Recording',
  delivered: 'Delivered',
  changes_requested: 'Changes requested',
  accepted: 'Accepted',
  paid_out: 'Paid out',
  disputed: 'Disputed',
  settled: 'Settled',
  cancelled: 'Cancelled',
};

export const bookingsQuerySchema = z.strictObject({
  all: z
    .enum(['0', '1', 'true', 'false'])
    .optional()
    .transform((v) => v === '1' || v === 'true'),
});
export type BookingsQuery = z.infer<typeof bookingsQuerySchema>;

export type BookingTermsView = {
  songTitle: string;
  lineItems: QuoteLineItemView[];
  totalMinor: number;
  currency: string;
  revisionsIncluded: number;
  extraRevisionMinor: number;
  turnaroundDays: number;
  recordingDate: string | null;
  rightsTerms: RightsTerms;
  royaltyPoints: number | null;
  deliverables: { sampleRate: number; bitDepth: '24' | '32f'; stemMode: 'every_mic' | 'named'; stemList: string[]; roughMix: boolean };
  tempoBpm: number;
  timeSignature: string;
  lengthBars: number | null;
  lengthSeconds: number | null;
  packageName: string | null;
};

export type PartyView = { id: string; displayName: string };

export type BookingView = {
  id: string;
  briefId: string;
  quoteId: string;
  status: BookingStatus;
  terms: BookingTermsView;
  totalMinor: number;
  currency: string;
  drummerShareMinor: number;
  engineerShareMinor: number;
  songwriter: PartyView;
  drummer: PartyView;
  engineer: PartyView | null;
  /** The reader's part in it (admins who are no party read 'admin'). */
  myRole: 'songwriter' | 'drummer' | 'engineer' | 'admin';
  version: number;
  createdAt: string;
  updatedAt: string;
};

export type BookingList = { items: BookingView[]; total: number };
