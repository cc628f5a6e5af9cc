import { Router, type Request } from 'express';
import type { AppContext } from '../../app';
import { requireSignedIn, requireUser } from '../../auth/middleware';
import { bodyOf, queryOf, validateBody, validateQuery } from '../../http/validate';
import { receiveUpload } from '../../uploads/receive';
import { briefInputSchema, GUIDE_MAX_BYTES, inviteInputSchema, openBriefsQuerySchema } from '@shared/schemas/briefs';
import { createBriefsService } from './briefs.service';
import { streamStoredFile } from './stream-stored-file';

const idOf = (req: Request) => String(req.params.id);

export function briefsRoutes(ctx: AppContext): Router {
  const service = createBriefsService(ctx);
  const r = Router();
  r.use('/briefs', requireSignedIn);

  r.post('/briefs', validateBody(briefInputSchema), (_req, res) => {
    res.status(201).json({ brief: service.create(requireUser(res), bodyOf(res, briefInputSchema)) });
  });

  r.get('/briefs/mine', (_req, res) => {
    res.json(service.listMine(requireUser(res)));
  });

  r.get('/briefs/open', validateQuery(openBriefsQuerySchema), (_req, res) => {
    res.json(service.listOpen(requireUser(res), queryOf(res, openBriefsQuerySchema)));
  });

  r.get('/briefs/:id', (req, res) => {
    res.json({ brief: service.get(requireUser(res), idOf(req)) });
  });

  // The form always sends the whole brief, so an edit replaces every editable field.
  r.patch('/briefs/:id', validateBody(briefInputSchema), (req, res) => {
    res.json({ brief: service.update(requireUser(res), idOf(req), bodyOf(res, briefInputSchema)) });
  });

  r.post('/briefs/:id/publish', (req, res) => {
    res.json({ brief: service.publish(requireUser(res), idOf(req)) });
  });

  r.post('/briefs/:id/withdraw', (req, res) => {
    res.json({ brief: service.withdraw(requireUser(res), idOf(req)) });
  });

  r.post('/briefs/:id/invites', validateBody(inviteInputSchema), (req, res) => {
    res.json(service.invite(requireUser(res), idOf(req), bodyOf(res, inviteInputSchema).drummerIds));
  });

  r.post('/briefs/:id/guide', async (req, res) => {
    const user = requireUser(res);
    const brief = await service.attachGuide(user, idOf(req), () =>
      receiveUpload(req, res, { field: 'file', maxBytes: GUIDE_MAX_BYTES, accept: ['wav', 'mp3'], label: 'guide track' }),
    );
    res.json({ brief });
  });

  r.get('/briefs/:id/guide', async (req, res) => {
    const file = service.guideFile(requireUser(res), idOf(req), 'audio');
    await streamStoredFile(req, res, ctx.storage, file.key, file);
  });

  r.get('/briefs/:id/guide/peaks', async (req, res) => {
    const file = service.guideFile(requireUser(res), idOf(req), 'peaks');
    await streamStoredFile(req, res, ctx.storage, file.key, file);
  });

  return r;
}
