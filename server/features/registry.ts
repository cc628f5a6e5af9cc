import type { Router } from 'express';
import type { AppContext } from '../app';
import { briefsRoutes } from './briefs/briefs.routes';
import { quotesRoutes } from './quotes/quotes.routes';
import { bookingsRoutes } from './bookings/bookings.routes';
import { profilesRoutes } from './profiles/profiles.routes';
import { reelsRoutes } from './reels/reels.routes';
import { searchRoutes } from './search/search.routes';
import { messagesRoutes } from './messages/messages.routes';
import { notificationsRoutes } from './notifications/notifications.routes';
import { roomsFeatureRoutes } from './rooms/rooms-feature.routes';
import { paymentsRoutes } from './payments/payments.routes';
import { deliveriesRoutes } from './deliveries/deliveries.routes';
import { disputesRoutes } from './disputes/disputes.routes';
import { adminRoutes } from './admin/admin.routes';
import { reviewsRoutes } from './reviews/reviews.routes';

/**
 * Each feature contributes one router factory. Add a line here when a feature gets routes;
 * the authorization-matrix test reads the resulting route table.
 *
 * Every router turns signed-out callers (401) and, on admin paths, non-admins (403) away before it parses
 * any input: `r.use([...its private paths], requireSignedIn)` at the top of a router whose paths are all
 * private, `requireSignedIn` as the first handler of each private route in a router that also serves the
 * public. The matrix calls every route with input no schema accepts and fails on a 400 where 401/403 is due.
 */
export type FeatureRoutes = (ctx: AppContext) => Router;

export const featureRoutes: FeatureRoutes[] = [
  briefsRoutes, quotesRoutes, bookingsRoutes,
  profilesRoutes, reelsRoutes, searchRoutes,
  messagesRoutes, notificationsRoutes,
  roomsFeatureRoutes,
  paymentsRoutes,
  deliveriesRoutes,
  disputesRoutes, adminRoutes, reviewsRoutes,
];
