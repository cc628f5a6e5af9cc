// @vitest-environment jsdom
// When the payment service is down the server answers 503 payment_unavailable with a "try again" message;
// the pay button and the payout set-up must show that message, and work on the next click.
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { cleanup, fireEvent, screen, waitFor } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import { setupServer } from 'msw/node';
import type { BookingMoneyView, PayoutAccountView } from '@shared/schemas/payments';
import { renderAt } from '@/testing/render-with-providers';
import { EscrowPanel } from './escrow-panel';
import { PayoutSection } from './payout-section';

const TRY_AGAIN = 'The payment service cannot be reached right now. Nothing was charged or changed; please try again in a minute.';
const unavailable = () => HttpResponse.json({ error: { code: 'payment_unavailable', message: TRY_AGAIN } }, { status: 503, headers: { 'retry-after': '30' } });

const money: BookingMoneyView = {
  bookingId: 'b1',
  bookingStatus: 'awaiting_payment',
  stage: 'awaiting_payment',
  currency: 'USD',
  checkout: { agreedMinor: 30_000, serviceFeeMinor: 1_500, totalMinor: 31_500 },
  paidMinor: 0,
  escrowHeldMinor: 0,
  payments: [],
  payouts: [],
  receipts: [],
  autoAcceptAt: null,
  addOn: { needed: 0, amountMinor: 0, feeMinor: 0 },
  cancelRequestedBy: [],
  can: { pay: true, payAddOn: false, cancel: false, release: false, refund: false, split: false },
  notice: 'notice',
};
const account: PayoutAccountView = { connected: false, payoutsEnabled: false, detailsSubmitted: false, waiting: [], notice: 'notice' };

const server = setupServer();
beforeAll(() => server.listen({ onUnhandledRequest: 'error' }));
afterEach(() => {
  cleanup();
  server.resetHandlers();
});
afterAll(() => server.close());

describe('a payment service outage as the user sees it', () => {
  it('shows the server’s try-again message under the pay button, and the next click asks the server again', async () => {
    let checkouts = 0;
    server.use(
      http.get('*/api/bookings/b1/money', () => HttpResponse.json({ money })),
      http.post('*/api/bookings/b1/checkout', () => {
        checkouts += 1;
        return checkouts === 1 ? unavailable() : HttpResponse.json({ error: { code: 'booking_state', message: 'This booking is not awaiting payment' } }, { status: 409 });
      }),
    );
    renderAt(<EscrowPanel bookingId="b1" />);
    fireEvent.click(await screen.findByRole('button', { name: /Pay \$315\.00/ }));
    expect((await screen.findByRole('alert')).textContent).toBe(TRY_AGAIN);
    // The button stays usable: a retry is one click away and reaches the server again.
    fireEvent.click(screen.getByRole('button', { name: /Pay \$315\.00/ }));
    await waitFor(() => expect(screen.getByRole('alert').textContent).toBe('This booking is not awaiting payment'));
    expect(checkouts).toBe(2);
  });

  it('shows the same message when payout onboarding cannot reach the payment service', async () => {
    server.use(
      http.get('*/api/payouts/account', () => HttpResponse.json({ account })),
      http.post('*/api/payouts/account/onboarding', () => unavailable()),
    );
    renderAt(<PayoutSection />);
    fireEvent.click(await screen.findByRole('button', { name: 'Set up payouts' }));
    expect((await screen.findByRole('alert')).textContent).toBe(TRY_AGAIN);
    expect(screen.getByRole('button', { name: 'Set up payouts' }).hasAttribute('disabled')).toBe(false);
  });
});
