import { Router } from 'express';
import type { AppContext } from '../../app';
import { validateQuery, queryOf } from '../../http/validate';
import { drummerSearchQuerySchema } from '@shared/schemas/profiles';
import { createSearchRepository } from './search.repository';
import { createSearchService } from './search.service';

export function searchRoutes(ctx: AppContext): Router {
  const search = createSearchService(createSearchRepository(ctx.db.$client));
  const r = Router();

  // Public: anyone may look for a drummer; only listed profiles are in the index's answers.
  r.get('/drummers', validateQuery(drummerSearchQuerySchema), (_req, res) => {
    res.json(search.searchDrummers(queryOf(res, drummerSearchQuerySchema)));
  });

  return r;
}
