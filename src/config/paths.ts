// Every route path of the client in one table. `path` is what the router matches; `getHref` builds a link
// (with query strings where a page reads one), so no component types a URL by hand.

/** Only same-app paths are accepted as a return address, so a crafted link cannot send people off-site. */
export function safeNext(next: string | null | undefined): string | null {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return null;
  return next;
}

function withNext(base: string, next?: string | null): string {
  const safe = safeNext(next);
  return safe ? `${base}?next=${encodeURIComponent(safe)}` : base;
}

export const paths = {
  home: { path: '/', getHref: () => '/' },
  signIn: { path: '/sign-in', getHref: (next?: string | null) => withNext('/sign-in', next) },
  signUp: { path: '/sign-up', getHref: () => '/sign-up' },
  checkInbox: { path: '/sign-up/check-inbox', getHref: () => '/sign-up/check-inbox' },
  verifyEmail: { path: '/verify-email', getHref: (token: string) => `/verify-email?token=${encodeURIComponent(token)}` },
  forgotPassword: { path: '/forgot-password', getHref: () => '/forgot-password' },
  resetPassword: { path: '/reset-password', getHref: (token: string) => `/reset-password?token=${encodeURIComponent(token)}` },
  account: { path: '/account', getHref: () => '/account' },

  // Filled by later issues; until then they render the "coming soon in this build" page.
  myBriefs: { path: '/briefs/mine', getHref: () => '/briefs/mine' },
  newBrief: { path: '/briefs/new', getHref: () => '/briefs/new' },
  brief: { path: '/briefs/:briefId', getHref: (id: string) => `/briefs/${encodeURIComponent(id)}` },
  editBrief: { path: '/briefs/:briefId/edit', getHref: (id: string) => `/briefs/${encodeURIComponent(id)}/edit` },
  compareQuotes: { path: '/briefs/:briefId/quotes', getHref: (id: string) => `/briefs/${encodeURIComponent(id)}/quotes` },
  quote: { path: '/quotes/:quoteId', getHref: (id: string) => `/quotes/${encodeURIComponent(id)}` },
  booking: { path: '/bookings/:bookingId', getHref: (id: string) => `/bookings/${encodeURIComponent(id)}` },
  delivery: { path: '/deliveries/:deliveryId', getHref: (id: string) => `/deliveries/${encodeURIComponent(id)}` },
  openBriefs: { path: '/briefs', getHref: (search?: string) => (search ? `/briefs?${search}` : '/briefs') },
  findDrummers: { path: '/drummers', getHref: (search?: string) => (search ? `/drummers?${search}` : '/drummers') },
  drummer: { path: '/drummers/:drummerId', getHref: (id: string) => `/drummers/${encodeURIComponent(id)}` },
  engineer: { path: '/engineers/:engineerId', getHref: (id: string) => `/engineers/${encodeURIComponent(id)}` },
  rooms: { path: '/rooms', getHref: () => '/rooms' },
  myRooms: { path: '/rooms/mine', getHref: () => '/rooms/mine' },
  newRoom: { path: '/rooms/new', getHref: () => '/rooms/new' },
  room: { path: '/rooms/:roomId', getHref: (id: string) => `/rooms/${encodeURIComponent(id)}` },
  editRoom: { path: '/rooms/:roomId/edit', getHref: (id: string) => `/rooms/${encodeURIComponent(id)}/edit` },
  newMicPackage: { path: '/rooms/:roomId/packages/new', getHref: (roomId: string) => `/rooms/${encodeURIComponent(roomId)}/packages/new` },
  editMicPackage: { path: '/packages/:packageId/edit', getHref: (id: string) => `/packages/${encodeURIComponent(id)}/edit` },
  myProfile: { path: '/profile', getHref: () => '/profile' },
  myQuotes: { path: '/quotes', getHref: () => '/quotes' },
  messages: { path: '/messages', getHref: () => '/messages' },
  messageThread: { path: '/messages/:threadId', getHref: (threadId: string) => `/messages/${encodeURIComponent(threadId)}` },
  bookings: { path: '/bookings', getHref: () => '/bookings' },
  notifications: { path: '/notifications', getHref: () => '/notifications' },
  // `mute` preselects one kind: the unsubscribe link at the foot of every notification mail.
  notificationSettings: { path: '/notifications/settings', getHref: (mute?: string) => (mute ? `/notifications/settings?mute=${encodeURIComponent(mute)}` : '/notifications/settings') },
  adminDesk: { path: '/admin', getHref: () => '/admin' },
  adminDispute: { path: '/admin/disputes/:disputeId', getHref: (id: string) => `/admin/disputes/${encodeURIComponent(id)}` },
  adminBookings: { path: '/admin/bookings', getHref: () => '/admin/bookings' },
  adminAccounts: { path: '/admin/accounts', getHref: () => '/admin/accounts' },
  adminLedger: { path: '/admin/ledger', getHref: (bookingId?: string) => (bookingId ? `/admin/ledger?booking=${encodeURIComponent(bookingId)}` : '/admin/ledger') },
  adminAudit: { path: '/admin/audit', getHref: () => '/admin/audit' },
} as const;

export type PathName = keyof typeof paths;
