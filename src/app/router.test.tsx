// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import { QueryClientProvider } from '@tanstack/react-query';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { fakeServer, testQueryClient } from '@/testing/render-with-providers';
import { bookingQueryOptions } from '@/features/bookings/api/get-booking';
import { bookingDeliveriesQueryOptions } from '@/features/deliveries/api/get-booking-deliveries';
import { deliveryQueryOptions } from '@/features/deliveries/api/get-delivery';
import { bookingDisputesQueryOptions } from '@/features/disputes/api/get-booking-disputes';
import { bookingMoneyQueryOptions } from '@/features/payments/api/get-booking-money';
import { bookingReviewsQueryOptions } from '@/features/reviews/api/get-booking-reviews';
import { sessionPrepQueryOptions } from '@/features/session-prep/api/get-session-prep';
import { createRoutes } from './router';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const drummer = { id: 'u1', email: 'rosa@kitlane.test', displayName: 'Rim Shot Rosa', roles: ['drummer'], emailVerified: true, timeZone: 'UTC' };

function startAt(path: string, user: typeof drummer | null) {
  fakeServer([
    { method: 'GET', path: '/api/me', status: 200, body: { user } },
    { method: 'GET', path: '/api/config', status: 200, body: { mailInboxUrl: null } },
  ]);
  const queryClient = testQueryClient();
  const router = createMemoryRouter(createRoutes(queryClient), { initialEntries: [path] });
  render(
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
  return router;
}

async function h1(): Promise<string> {
  // Generous: the first lazy page import is transformed on demand by Vite in the test run.
  return (await screen.findByRole('heading', { level: 1 }, { timeout: 5000 })).textContent ?? '';
}

describe('app routes', () => {
  it('sends a signed-out visitor of the account page to sign in, with the way back', async () => {
    const router = startAt('/account', null);
    expect(await h1()).toBe('Sign in');
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(router.state.location.search).toBe('?next=%2Faccount');
  });

  it('shows the account page to a signed-in person', async () => {
    startAt('/account', drummer);
    expect(await h1()).toBe('Account');
    expect(screen.getByText('Signed in as Rim Shot Rosa')).toBeTruthy();
  });

  it('sends a signed-in person away from the sign-up page', async () => {
    const router = startAt('/sign-up', drummer);
    expect(await h1()).toBe('Welcome back, Rim Shot Rosa.');
    expect(router.state.location.pathname).toBe('/');
  });

  it('shows the 404 page inside the shell for an unknown address', async () => {
    startAt('/no/such/page', null);
    expect(await h1()).toBe('Page not found');
    expect(screen.getByRole('banner')).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Back to the home page' }).getAttribute('href')).toBe('/');
  });

  it('has every panel of the booking page fetched before the page first renders, so nothing below shifts', async () => {
    const booking = '/api/bookings/b1';
    const server = fakeServer([
      { method: 'GET', path: '/api/me', status: 200, body: { user: drummer } },
      { method: 'GET', path: booking, status: 200, body: { booking: { id: 'b1' } } },
      { method: 'GET', path: `${booking}/money`, status: 200, body: { money: { stage: 'funded' } } },
      { method: 'GET', path: `${booking}/disputes`, status: 200, body: { items: [] } },
      { method: 'GET', path: `${booking}/reviews`, status: 200, body: { items: [], canReview: [] } },
      { method: 'GET', path: `${booking}/deliveries`, status: 200, body: { items: [], canCreate: false } },
      { method: 'GET', path: `${booking}/prep`, status: 200, body: { prep: null } },
    ]);
    const queryClient = testQueryClient();
    // Not rendered: whatever is in the cache once the route is ready was fetched by its loader, not by a panel.
    const router = createMemoryRouter(createRoutes(queryClient), { initialEntries: ['/bookings/b1'] });
    await vi.waitFor(() => expect(router.state.initialized).toBe(true), { timeout: 5000 });
    const keys = [bookingQueryOptions, bookingMoneyQueryOptions, bookingDisputesQueryOptions, bookingReviewsQueryOptions, bookingDeliveriesQueryOptions, sessionPrepQueryOptions].map((options) => options('b1').queryKey);
    expect(keys.map((key) => queryClient.getQueryState(key)?.status)).toEqual(Array(6).fill('success'));
    expect(server.calls.filter((c) => c.path.startsWith(booking))).toHaveLength(6);
    router.dispose();
  });

  it('has the delivery, its booking and its versions fetched before the review room first renders', async () => {
    const server = fakeServer([
      { method: 'GET', path: '/api/me', status: 200, body: { user: drummer } },
      { method: 'GET', path: '/api/deliveries/d1', status: 200, body: { delivery: { id: 'd1', bookingId: 'b7', number: 1 } } },
      { method: 'GET', path: '/api/bookings/b7', status: 200, body: { booking: { id: 'b7' } } },
      { method: 'GET', path: '/api/bookings/b7/deliveries', status: 200, body: { items: [], canCreate: false } },
    ]);
    const queryClient = testQueryClient();
    const router = createMemoryRouter(createRoutes(queryClient), { initialEntries: ['/deliveries/d1'] });
    await vi.waitFor(() => expect(router.state.initialized).toBe(true), { timeout: 5000 });
    const keys = [deliveryQueryOptions('d1').queryKey, bookingQueryOptions('b7').queryKey, bookingDeliveriesQueryOptions('b7').queryKey];
    expect(keys.map((key) => queryClient.getQueryState(key)?.status)).toEqual(['success', 'success', 'success']);
    expect(server.calls.map((c) => c.path).filter((p) => p !== '/api/me').sort()).toEqual(['/api/bookings/b7', '/api/bookings/b7/deliveries', '/api/deliveries/d1']);
    router.dispose();
  });

  it('sends a signed-out visitor of a delivery to sign in, the delivery request dropped', async () => {
    fakeServer([
      { method: 'GET', path: '/api/me', status: 200, body: { user: null } },
      { method: 'GET', path: '/api/deliveries/d1', status: 401, body: { error: { code: 'unauthorized', message: 'Sign in first' } } },
    ]);
    const queryClient = testQueryClient();
    const router = createMemoryRouter(createRoutes(queryClient), { initialEntries: ['/deliveries/d1'] });
    await vi.waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'), { timeout: 5000 });
    expect(router.state.location.search).toBe('?next=%2Fdeliveries%2Fd1');
    router.dispose();
  });

  it('shows the error page with a way back when the server cannot be reached', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => Promise.reject(new TypeError('fetch failed'))));
    const queryClient = testQueryClient();
    const router = createMemoryRouter(createRoutes(queryClient), { initialEntries: ['/'] });
    render(
      <QueryClientProvider client={queryClient}>
        <RouterProvider router={router} />
      </QueryClientProvider>,
    );
    expect(await h1()).toBe('Something went wrong');
    expect(screen.getByRole('alert').textContent).toMatch(/could not be reached/);
    expect(screen.getByRole('button', { name: 'Try again' })).toBeTruthy();
  });
});
