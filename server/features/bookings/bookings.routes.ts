import { Router, type Request } from 'express';
import type { AppContext } from '../../app';
import { requireSignedIn, requireUser } from '../../auth/middleware';
import { queryOf, validateQuery } from '../../http/validate';
import { bookingsQuerySchema } from '@shared/schemas/bookings';
import { createBookingsService } from './bookings.service';

const idOf = (req: Request) => String(req.params.id);

export function bookingsRoutes(ctx: AppContext): Router {
  const service = createBookingsService({ db: ctx.db });
  const r = Router();
  r.use('/bookings', requireSignedIn);

  r.get('/bookings', validateQuery(bookingsQuerySchema), (_req, res) => {
    res.json(service.list(requireUser(res), queryOf(res, bookingsQuerySchema)));
  });

  r.get('/bookings/:id', (req, res) => {
    res.json({ booking: service.get(requireUser(res), idOf(req)) });
  });

  return r;
}
