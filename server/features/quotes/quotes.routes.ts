import { Router, type Request } from 'express';
import type { AppContext } from '../../app';
import { requireSignedIn, requireUser } from '../../auth/middleware';
import { bodyOf, validateBody } from '../../http/validate';
import { declineQuoteInputSchema, engineerResponseInputSchema, quoteInputSchema } from '@shared/schemas/quotes';
import { createQuotesService } from './quotes.service';

const idOf = (req: Request) => String(req.params.id);

export function quotesRoutes(ctx: AppContext): Router {
  const service = createQuotesService(ctx);
  const r = Router();
  r.use(['/briefs/:id/quotes', '/quotes'], requireSignedIn);

  r.post('/briefs/:id/quotes', validateBody(quoteInputSchema), (req, res) => {
    res.status(201).json({ quote: service.create(requireUser(res), idOf(req), bodyOf(res, quoteInputSchema)) });
  });

  r.get('/briefs/:id/quotes', (req, res) => {
    res.json(service.listForBrief(requireUser(res), idOf(req)));
  });

  r.get('/quotes/mine', (_req, res) => {
    res.json(service.listMine(requireUser(res)));
  });

  r.get('/quotes/engineer-requests', (_req, res) => {
    res.json(service.listEngineerRequests(requireUser(res)));
  });

  r.get('/quotes/:id', (req, res) => {
    res.json({ quote: service.get(requireUser(res), idOf(req)) });
  });

  r.post('/quotes/:id/withdraw', (req, res) => {
    res.json({ quote: service.withdraw(requireUser(res), idOf(req)) });
  });

  r.post('/quotes/:id/decline', validateBody(declineQuoteInputSchema), (req, res) => {
    res.json({ quote: service.decline(requireUser(res), idOf(req), bodyOf(res, declineQuoteInputSchema).reason) });
  });

  r.post('/quotes/:id/accept', (req, res) => {
    res.status(201).json({ booking: service.accept(requireUser(res), idOf(req)) });
  });

  r.post('/quotes/:id/engineer-response', validateBody(engineerResponseInputSchema), (req, res) => {
    res.json({ quote: service.engineerResponse(requireUser(res), idOf(req), bodyOf(res, engineerResponseInputSchema).confirm) });
  });

  return r;
}
