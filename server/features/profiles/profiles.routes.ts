import { Router } from 'express';
import type { AppContext } from '../../app';
import { validateBody, bodyOf } from '../../http/validate';
import { optionalUser, requireSignedIn, requireUser } from '../../auth/middleware';
import { drummerProfileInputSchema, engineerProfileInputSchema } from '@shared/schemas/profiles';
import { createProfilesRepository } from './profiles.repository';
import { createProfilesService } from './profiles.service';
import { createReelsRepository } from '../reels/reels.repository';

export function profilesRoutes(ctx: AppContext): Router {
  const profiles = createProfilesService({ db: ctx.db, repo: createProfilesRepository(ctx.db), reels: createReelsRepository(ctx.db) });
  const r = Router();
  // One's own profiles; the public pages are /drummers/:id and /engineers/:id.
  r.use('/profile', requireSignedIn);

  r.get('/profile/drummer', (_req, res) => {
    res.json(profiles.getOwnDrummer(requireUser(res)));
  });

  r.put('/profile/drummer', validateBody(drummerProfileInputSchema), (_req, res) => {
    res.json(profiles.saveOwnDrummer(requireUser(res), bodyOf(res, drummerProfileInputSchema)));
  });

  // GET /drummers (the search) lives in features/search; this is one drummer's public page.
  r.get('/drummers/:id', (req, res) => {
    res.json({ drummer: profiles.getPublicDrummer(optionalUser(res), req.params.id) });
  });

  r.get('/profile/engineer', (_req, res) => {
    res.json(profiles.getOwnEngineer(requireUser(res)));
  });

  r.put('/profile/engineer', validateBody(engineerProfileInputSchema), (_req, res) => {
    res.json(profiles.saveOwnEngineer(requireUser(res), bodyOf(res, engineerProfileInputSchema)));
  });

  r.get('/engineers/:id', (req, res) => {
    res.json({ engineer: profiles.getPublicEngineer(optionalUser(res), req.params.id) });
  });

  return r;
}
