import type { AppContext } from '../app';
import { messagesSeedStep } from '../features/messages/messages.seed';
import { profilesSeedStep } from '../features/profiles/profiles.seed';
import { briefsSeedStep } from '../features/briefs/briefs.seed';
import { roomsSeedStep } from '../features/rooms/rooms.seed';
import { paymentsSeedStep } from '../features/payments/payments.seed';
import { disputesSeedStep } from '../features/disputes/disputes.seed';
import { deliveriesSeedStep } from '../features/deliveries/deliveries.seed';

/** What the seed knows after creating the demo accounts: demo key (e.g. 'mara') → user id. */
export type SeedState = { userIds: Record<string, string>; [k: string]: unknown };

/**
 * Each feature adds its demo data here, in order, through its own services (so the demo obeys the
 * same rules as users do). A step may put what later steps need into the state.
 */
export type SeedStep = { name: string; run(ctx: AppContext, state: SeedState): Promise<void> | void };

// Profiles first: briefs, quotes and threads of later steps point at drummers with profiles and reels.
export const seedSteps: SeedStep[] = [
  profilesSeedStep,
  // Before briefs: a demo quote may name a mic package (state.micPackageIds).
  roomsSeedStep,
  briefsSeedStep,
  // After briefs: funds their booking and hires two more, paying on the payment fake.
  paymentsSeedStep,
  // After payments: needs its paid-out booking for a review, and payees with payout accounts.
  disputesSeedStep,
  // After payments: gives their delivered booking a real, checked and submitted v1.
  deliveriesSeedStep,
  // Keep last: the demo conversations are about the briefs, quotes and bookings the steps above create.
  messagesSeedStep,
];
