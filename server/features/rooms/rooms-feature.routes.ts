import { Router } from 'express';
import type { AppContext } from '../../app';
import { micPackagesRoutes } from '../mic-packages/mic-packages.routes';
import { sessionPrepRoutes } from '../session-prep/session-prep.routes';
import { roomsRoutes } from './rooms.routes';

/** Rooms, their mic packages and the session prep of bookings with a room (issue 6), as one registry entry. */
export function roomsFeatureRoutes(ctx: AppContext): Router {
  return Router().use(roomsRoutes(ctx), micPackagesRoutes(ctx), sessionPrepRoutes(ctx));
}
