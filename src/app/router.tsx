import { createBrowserRouter, redirect, type LoaderFunctionArgs, type RouteObject } from 'react-router-dom';
import type { QueryClient } from '@tanstack/react-query';
import { paths } from '@/config/paths';
import { PageSpinner } from '@/components/ui';
import { meQueryOptions } from '@/features/auth/api/get-me';
import { RootLayout } from './routes/root';
import { RouteError, RootError } from './routes/route-error';
import type { ComingSoonHandle } from './routes/coming-soon';

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
  comingSoon: () => import('./routes/coming-soon'),
};

/** Route stubs: navigation targets whose features later issues build. Each renders the one coming-soon page. */
const COMING_SOON: Array<{ path: string; title: string; description: string; signedIn: boolean }> = [
  { path: paths.findDrummers.path, title: 'Find drummers', description: 'Search session drummers by style, rate and turnaround.', signedIn: false },
  { path: paths.rooms.path, title: 'Rooms', description: 'Rooms and mic packages that engineers offer for drum sessions.', signedIn: false },
  { path: paths.myBriefs.path, title: 'My briefs', description: 'The songs you want drums for, and the quotes they received.', signedIn: true },
  { path: paths.openBriefs.path, title: 'Open briefs', description: 'Songs waiting for a drummer, ready for your quote.', signedIn: true },
  { path: paths.myProfile.path, title: 'My profile', description: 'What songwriters see about you: styles, kit, rates, reel and rooms.', signedIn: true },
  { path: paths.myQuotes.path, title: 'My quotes', description: 'The quotes you sent and where each one stands.', signedIn: true },
  { path: paths.myRooms.path, title: 'My rooms', description: 'Your rooms and mic packages, with their acoustics.', signedIn: true },
  { path: paths.messages.path, title: 'Messages', description: 'Your conversations about briefs and bookings.', signedIn: true },
  { path: paths.bookings.path, title: 'Bookings', description: 'Hired jobs: payment, recording, deliveries and acceptance.', signedIn: true },
  { path: paths.notifications.path, title: 'Notifications', description: 'New quotes, messages, deliveries and payments.', signedIn: true },
  { path: paths.adminDesk.path, title: 'Admin desk', description: 'Disputes, accounts and the money ledger.', signedIn: true },
];

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
  // Someone already signed in has nothing to do on sign-in or sign-up.
  const requireSignedOut = async () => {
    const me = await loadMe();
    if (me.user) throw redirect(paths.home.getHref());
    return null;
  };

  const comingSoonRoutes: RouteObject[] = COMING_SOON.map((stub) => ({
    path: stub.path,
    lazy: page.comingSoon,
    loader: stub.signedIn ? requireSignedIn : undefined,
    handle: { comingSoon: { title: stub.title, description: stub.description } } satisfies ComingSoonHandle,
  }));

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
            ...comingSoonRoutes,
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
