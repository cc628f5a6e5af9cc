import { Router, type Request } from 'express';
import type { AppContext } from '../../app';
import { optionalUser, requireSignedIn, requireUser } from '../../auth/middleware';
import { bodyOf, validateBody } from '../../http/validate';
import { micPackageInputSchema, micPackageUpdateInputSchema } from '@shared/schemas/mic-packages';
import { createMicPackagesService } from './mic-packages.service';

const idOf = (req: Request) => String(req.params.id);

export function micPackagesRoutes(ctx: AppContext): Router {
  const packages = createMicPackagesService(ctx);
  const r = Router();
  // Packages are public to read; every private route starts with requireSignedIn, before any input is parsed.

  r.get('/rooms/:id/packages', (req, res) => {
    res.json(packages.listForRoom(optionalUser(res), idOf(req)));
  });

  r.post('/rooms/:id/packages', requireSignedIn, validateBody(micPackageInputSchema), (req, res) => {
    res.status(201).json({ package: packages.create(requireUser(res), idOf(req), bodyOf(res, micPackageInputSchema)) });
  });

  // Before /mic-packages/:id so "mine" is never read as an id.
  r.get('/mic-packages/mine', requireSignedIn, (_req, res) => {
    res.json(packages.listMine(requireUser(res)));
  });

  r.get('/mic-packages/:id', (req, res) => {
    res.json({ package: packages.get(optionalUser(res), idOf(req)) });
  });

  r.patch('/mic-packages/:id', requireSignedIn, validateBody(micPackageUpdateInputSchema), (req, res) => {
    res.json({ package: packages.update(requireUser(res), idOf(req), bodyOf(res, micPackageUpdateInputSchema)) });
  });

  r.delete('/mic-packages/:id', requireSignedIn, (req, res) => {
    packages.archive(requireUser(res), idOf(req));
    res.status(204).end();
  });

  return r;
}
