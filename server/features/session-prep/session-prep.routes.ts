import { Router, type Request } from 'express';
import type { AppContext } from '../../app';
import { requireSignedIn, requireUser } from '../../auth/middleware';
import { bodyOf, validateBody } from '../../http/validate';
import { prepItemParamsSchema, prepTickInputSchema } from '@shared/schemas/session-prep';
import { createSessionPrepService } from './session-prep.service';

const idOf = (req: Request) => String(req.params.id);

export function sessionPrepRoutes(ctx: AppContext): Router {
  const prep = createSessionPrepService(ctx);
  const r = Router();
  r.use('/bookings/:id/prep', requireSignedIn);

  r.get('/bookings/:id/prep', (req, res) => {
    res.json({ prep: prep.get(requireUser(res), idOf(req)) });
  });

  r.put('/bookings/:id/prep/:itemId', validateBody(prepTickInputSchema), (req, res) => {
    const { itemId } = prepItemParamsSchema.parse({ itemId: req.params.itemId });
    res.json({ prep: prep.tick(requireUser(res), idOf(req), itemId, bodyOf(res, prepTickInputSchema).done) });
  });

  return r;
}
