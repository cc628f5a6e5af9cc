import { createBrowserRouter, redirect, type LoaderFunctionArgs, type RouteObject } from 'react-router-dom';
import type { QueryClient } from '@tanstack/react-query';
import { paths } from '@/config/paths';
import { PageSpinner } from '@/components/ui';
import { meQueryOptions } from '@/features/auth/api/get-me';
import { briefQueryOptions } from '@/features/briefs/api/get-brief';
import { briefQuotesQueryOptions } from '@/features/quotes/api/get-brief-quotes';
import { quoteQueryOptions } from '@/features/quotes/api/get-quote';
import { bookingQueryOptions } from '@/features/bookings/api/get-booking';
import { bookingDisputesQueryOptions } from '@/features/disputes/api/get-booking-disputes';
import { bookingMoneyQueryOptions } from '@/features/payments/api/get-booking-money';
import { bookingReviewsQueryOptions } from '@/features/reviews/api/get-booking-reviews';
import { sessionPrepQueryOptions } from '@/features/session-prep/api/get-session-prep';
import { roomQueryOptions } from '@/features/rooms/api/get-room';
import { RootLayout } from './routes/root';
import { RouteError, RootError } from './routes/route-error';

// Pages are separate chunks (React Router `lazy`), so the home page does not carry later, heavier features.
const page = {
  home: () => import('./routes/home'),
  signIn: () => import('./routes/sign-in'),
  signUp: () => import('./routes/sign-up'),
  checkInbox: () => import('./routes/check-inbox'),
  verifyEmail: () => import('./routes/verify-email'),
  forgotPassword: () => import('./routes/forgot-password'),
  resetPassword: () => import('./routes/reset-password'),
  account: () => import('./routes/account'),
  notFound: () => import('./routes/not-found'),
  myBriefs: () => import('./routes/my-briefs'),
  newBrief: () => import('./routes/new-brief'),
  brief: () => import('./routes/brief-detail'),
  editBrief: () => import('./routes/edit-brief'),
  openBriefs: () => import('./routes/open-briefs'),
  compareQuotes: () => import('./routes/compare-quotes'),
  myQuotes: () => import('./routes/my-quotes'),
  quote: () => import('./routes/quote-detail'),
  bookings: () => import('./routes/bookings'),
  booking: () => import('./routes/booking-detail'),
  delivery: () => import('./routes/delivery'),
  findDrummers: () => import('./routes/find-drummers'),
  drummer: () => import('./routes/drummer-profile'),
  engineer: () => import('./routes/engineer-profile'),
  myProfile: () => import('./routes/my-profile'),
  rooms: () => import('./routes/rooms'),
  myRooms: () => import('./routes/my-rooms'),
  newRoom: () => import('./routes/new-room'),
  room: () => import('./routes/room-detail'),
  editRoom: () => import('./routes/edit-room'),
  newMicPackage: () => import('./routes/new-mic-package'),
  editMicPackage: () => import('./routes/edit-mic-package'),
  messages: () => import('./routes/messages'),
  messageThread: () => import('./routes/message-thread'),
  notifications: () => import('./routes/notifications'),
  notificationSettings: () => import('./routes/notification-settings'),
  adminDisputes: () => import('./routes/admin-disputes'),
  adminDispute: () => import('./routes/admin-dispute'),
  adminBookings: () => import('./routes/admin-bookings'),
  adminAccounts: () => import('./routes/admin-accounts'),
  adminLedger: () => import('./routes/admin-ledger'),
  adminAudit: () => import('./routes/admin-audit'),
};

// The deliveries' requests build their URLs with `deliveryPaths`, which lives beside the deliveries' zod
// schemas: imported statically here, they put all of zod into every page's first download. Loaded on demand,
// zod comes with the pages that validate forms or show deliveries.
const deliveriesApi = {
  delivery: () => import('@/features/deliveries/api/get-delivery'),
  bookingDeliveries: () => import('@/features/deliveries/api/get-booking-deliveries'),
};

function pathOf(request: Request): string {
  const url = new URL(request.url);
  return url.pathname + url.search;
}

export function createRoutes(queryClient: QueryClient): RouteObject[] {
  // The header needs to know who is signed in before the first paint, or it would flash the guest links.
  const loadMe = () => queryClient.ensureQueryData(meQueryOptions());

  const requireSignedIn = async ({ request }: LoaderFunctionArgs) => {
    const me = await loadMe();
    if (!me.user) throw redirect(paths.signIn.getHref(pathOf(request)));
    return null;
  };
  // The admin desk is not shown to anyone else: the same "not found" as for a page that does not exist.
  const requireAdmin = async (args: LoaderFunctionArgs) => {
    await requireSignedIn(args);
    const me = await loadMe();
    if (!me.user?.roles.includes('admin')) throw new Response('Not found', { status: 404, statusText: 'Not Found' });
    return null;
  };
  // Detail pages start their request while the page's code loads; a failed request is shown by the page itself.
  const prefetching =
    (prefetch: (params: LoaderFunctionArgs['params']) => Promise<void>) =>
    async (args: LoaderFunctionArgs) => {
      await requireSignedIn(args);
      void prefetch(args.params);
      return null;
    };
  // The booking page is the booking plus a panel per feature (money, disputes, reviews, deliveries, room prep),
  // each with its own request. Fetched side by side and awaited, the page paints once, whole: when the panels
  // asked one by one after the booking arrived, each answer pushed the panels below it down (a layout shift of
  // 0.27 in Lighthouse). prefetchQuery never rejects, so a failed request is still shown by its panel.
  const loadBooking = async (args: LoaderFunctionArgs) => {
    // The deliveries' code is fetched while the session is checked, not after it.
    const deliveries = deliveriesApi.bookingDeliveries();
    await requireSignedIn(args);
    const id = args.params.bookingId ?? '';
    await Promise.all([
      queryClient.prefetchQuery(bookingQueryOptions(id)),
      queryClient.prefetchQuery(bookingMoneyQueryOptions(id)),
      queryClient.prefetchQuery(bookingDisputesQueryOptions(id)),
      queryClient.prefetchQuery(bookingReviewsQueryOptions(id)),
      queryClient.prefetchQuery(sessionPrepQueryOptions(id)),
      deliveries.then(({ bookingDeliveriesQueryOptions }) => queryClient.prefetchQuery(bookingDeliveriesQueryOptions(id))),
    ]);
    return null;
  };
  // The review room likewise: the delivery names its booking, and the booking and its versions are fetched
  // side by side once it is in; the page then mounts once, whole, inside the router's transition. When the
  // page mounted on the delivery alone, the booking's answer re-rendered it synchronously and started every
  // stem's download in that same task: one 400 ms block of the main thread in Lighthouse.
  const loadDelivery = async (args: LoaderFunctionArgs) => {
    const api = Promise.all([deliveriesApi.delivery(), deliveriesApi.bookingDeliveries()]);
    // The delivery is asked for while the session is checked; signed out, its 401 is dropped with the redirect.
    const delivery = api.then(async ([{ deliveryQueryOptions }]) => {
      const options = deliveryQueryOptions(args.params.deliveryId ?? '');
      await queryClient.prefetchQuery(options);
      return options;
    });
    await requireSignedIn(args);
    const [[, { bookingDeliveriesQueryOptions }], options] = await Promise.all([api, delivery]);
    const bookingId = queryClient.getQueryData(options.queryKey)?.bookingId;
    if (bookingId) await Promise.all([queryClient.prefetchQuery(bookingQueryOptions(bookingId)), queryClient.prefetchQuery(bookingDeliveriesQueryOptions(bookingId))]);
    return null;
  };
  // Someone already signed in has nothing to do on sign-in or sign-up.
  const requireSignedOut = async () => {
    const me = await loadMe();
    if (me.user) throw redirect(paths.home.getHref());
    return null;
  };

  return [
    {
      id: 'root',
      element: <RootLayout />,
      loader: async () => {
        await loadMe();
        return null;
      },
      errorElement: <RootError />,
      hydrateFallbackElement: <PageSpinner label="Starting Kitlane" />,
      children: [
        {
          // Page errors render inside the shell, so the header and a way back stay on screen.
          errorElement: <RouteError />,
          children: [
            { index: true, lazy: page.home },
            { path: paths.signIn.path, lazy: page.signIn, loader: requireSignedOut },
            { path: paths.signUp.path, lazy: page.signUp, loader: requireSignedOut },
            { path: paths.checkInbox.path, lazy: page.checkInbox },
            { path: paths.verifyEmail.path, lazy: page.verifyEmail },
            { path: paths.forgotPassword.path, lazy: page.forgotPassword },
            { path: paths.resetPassword.path, lazy: page.resetPassword },
            { path: paths.account.path, lazy: page.account, loader: requireSignedIn },
            { path: paths.messages.path, lazy: page.messages, loader: requireSignedIn },
            { path: paths.messageThread.path, lazy: page.messageThread, loader: requireSignedIn },
            { path: paths.notifications.path, lazy: page.notifications, loader: requireSignedIn },
            { path: paths.notificationSettings.path, lazy: page.notificationSettings, loader: requireSignedIn },
            { path: paths.myBriefs.path, lazy: page.myBriefs, loader: requireSignedIn },
            { path: paths.newBrief.path, lazy: page.newBrief, loader: requireSignedIn },
            { path: paths.openBriefs.path, lazy: page.openBriefs, loader: requireSignedIn },
            { path: paths.brief.path, lazy: page.brief, loader: prefetching((p) => queryClient.prefetchQuery(briefQueryOptions(p.briefId ?? ''))) },
            { path: paths.editBrief.path, lazy: page.editBrief, loader: prefetching((p) => queryClient.prefetchQuery(briefQueryOptions(p.briefId ?? ''))) },
            { path: paths.compareQuotes.path, lazy: page.compareQuotes, loader: prefetching((p) => queryClient.prefetchQuery(briefQuotesQueryOptions(p.briefId ?? ''))) },
            { path: paths.myQuotes.path, lazy: page.myQuotes, loader: requireSignedIn },
            { path: paths.quote.path, lazy: page.quote, loader: prefetching((p) => queryClient.prefetchQuery(quoteQueryOptions(p.quoteId ?? ''))) },
            { path: paths.bookings.path, lazy: page.bookings, loader: requireSignedIn },
            { path: paths.booking.path, lazy: page.booking, loader: loadBooking },
            { path: paths.delivery.path, lazy: page.delivery, loader: loadDelivery },
            // Rooms are public listings (songwriters compare them); changing one needs a session.
            { path: paths.rooms.path, lazy: page.rooms },
            { path: paths.myRooms.path, lazy: page.myRooms, loader: requireSignedIn },
            { path: paths.newRoom.path, lazy: page.newRoom, loader: requireSignedIn },
            { path: paths.room.path, lazy: page.room, loader: ({ params }) => (void queryClient.prefetchQuery(roomQueryOptions(params.roomId ?? '')), null) },
            { path: paths.editRoom.path, lazy: page.editRoom, loader: prefetching((p) => queryClient.prefetchQuery(roomQueryOptions(p.roomId ?? ''))) },
            { path: paths.newMicPackage.path, lazy: page.newMicPackage, loader: prefetching((p) => queryClient.prefetchQuery(roomQueryOptions(p.roomId ?? ''))) },
            { path: paths.editMicPackage.path, lazy: page.editMicPackage, loader: requireSignedIn },
            { path: paths.adminDesk.path, lazy: page.adminDisputes, loader: requireAdmin },
            { path: paths.adminDispute.path, lazy: page.adminDispute, loader: requireAdmin },
            { path: paths.adminBookings.path, lazy: page.adminBookings, loader: requireAdmin },
            { path: paths.adminAccounts.path, lazy: page.adminAccounts, loader: requireAdmin },
            { path: paths.adminLedger.path, lazy: page.adminLedger, loader: requireAdmin },
            { path: paths.adminAudit.path, lazy: page.adminAudit, loader: requireAdmin },
            { path: paths.findDrummers.path, lazy: page.findDrummers },
            { path: paths.drummer.path, lazy: page.drummer },
            { path: paths.engineer.path, lazy: page.engineer },
            { path: paths.myProfile.path, lazy: page.myProfile, loader: requireSignedIn },
            { path: '*', lazy: page.notFound },
          ],
        },
      ],
    },
  ];
}

export function createAppRouter(queryClient: QueryClient) {
  return createBrowserRouter(createRoutes(queryClient));
}
