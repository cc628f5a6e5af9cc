import { Router, type Request } from 'express';
import type { AppContext } from '../../app';
import { requireSignedIn, requireUser } from '../../auth/middleware';
import { bodyOf, validateBody } from '../../http/validate';
import { openDisputeInputSchema } from '@shared/schemas/disputes';
import { disputesFor } from './disputes.feature';
import { FINISH_SETTLEMENT_JOB } from './disputes.service';

const idOf = (req: Request) => String(req.params.id);

/** The parties' side of disputes; the admin side lives in the admin desk's routes. */
export function disputesRoutes(ctx: AppContext): Router {
  const service = disputesFor(ctx);
  const r = Router();
  r.use('/bookings/:id/disputes', requireSignedIn);
  // On every start: settlements a previous run left between the processor call and the record.
  ctx.jobs.enqueue(FINISH_SETTLEMENT_JOB, { reason: 'startup' });

  r.get('/bookings/:id/disputes', (req, res) => {
    res.json(service.forBooking(requireUser(res), idOf(req)));
  });

  r.post('/bookings/:id/disputes', validateBody(openDisputeInputSchema), (req, res) => {
    res.status(201).json({ dispute: service.open(requireUser(res), idOf(req), bodyOf(res, openDisputeInputSchema)) });
  });

  return r;
}
