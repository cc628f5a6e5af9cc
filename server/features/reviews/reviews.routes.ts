import { Router, type Request } from 'express';
import type { AppContext } from '../../app';
import { requireSignedIn, requireUser } from '../../auth/middleware';
import { bodyOf, queryOf, validateBody, validateQuery } from '../../http/validate';
import { createReviewInputSchema, reviewsQuerySchema } from '@shared/schemas/reviews';
import { createReviewsService } from './reviews.service';

const idOf = (req: Request) => String(req.params.id);

export function reviewsRoutes(ctx: AppContext): Router {
  const service = createReviewsService({ db: ctx.db, notifications: ctx.notifications });
  const r = Router();
  // A booking's reviews are its parties'; a profile's are public.
  r.use('/bookings/:id/reviews', requireSignedIn);

  r.get('/bookings/:id/reviews', (req, res) => {
    res.json(service.forBooking(requireUser(res), idOf(req)));
  });

  r.post('/bookings/:id/reviews', validateBody(createReviewInputSchema), (req, res) => {
    const user = requireUser(res);
    res.status(201).json({ review: service.create(user, idOf(req), bodyOf(res, createReviewInputSchema)) });
  });

  r.get('/drummers/:id/reviews', validateQuery(reviewsQuerySchema), (req, res) => {
    res.json(service.forProfile(idOf(req), 'drummer', queryOf(res, reviewsQuerySchema).limit));
  });

  r.get('/engineers/:id/reviews', validateQuery(reviewsQuerySchema), (req, res) => {
    res.json(service.forProfile(idOf(req), 'engineer', queryOf(res, reviewsQuerySchema).limit));
  });

  return r;
}
