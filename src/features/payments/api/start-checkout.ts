import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getPublishableKey } from './get-publishable-key';

export type CheckoutKind = 'booking' | 'add_on';

export function startCheckout(bookingId: string, kind: CheckoutKind): Promise<{ url: string; sessionId: string }> {
  const path = kind === 'add_on' ? 'add-on/checkout' : 'checkout';
  return api.post(`/api/bookings/${encodeURIComponent(bookingId)}/${path}`);
}

/**
 * Sends the songwriter to the processor's hosted checkout page. With a real publishable key, Stripe.js is
 * loaded first (from '@stripe/stripe-js/pure', so nothing loads before this click) as the processor asks
 * pages that take payments to do; offline the payment fake's own page at session.url stands in.
 */
async function goToCheckout(url: string): Promise<void> {
  const key = await getPublishableKey();
  if (key) {
    const { loadStripe } = await import('@stripe/stripe-js/pure');
    await loadStripe(key);
  }
  window.location.assign(url);
}

export function useStartCheckout(bookingId: string, kind: CheckoutKind) {
  return useMutation({
    mutationFn: () => startCheckout(bookingId, kind),
    onSuccess: ({ url }) => goToCheckout(url),
  });
}
