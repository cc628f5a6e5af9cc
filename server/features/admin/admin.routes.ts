import { Router, type Request } from 'express';
import type { AppContext } from '../../app';
import { requirePermission, requireUser } from '../../auth/middleware';
import { bodyOf, queryOf, validateBody, validateQuery } from '../../http/validate';
import { accountActionInputSchema, adminAccountsQuerySchema, adminBookingsQuerySchema, auditQuerySchema } from '@shared/schemas/admin';
import { disputesQuerySchema, previewSettlementInputSchema, settleDisputeInputSchema } from '@shared/schemas/disputes';
import { createAuditService } from '../audit/audit.service';
import { disputesFor } from '../disputes/disputes.feature';
import { createAdminService } from './admin.service';
import { createDisputeCase } from './dispute-case';

const idOf = (req: Request) => String(req.params.id);

/**
 * The admin desk's API. Every route asks the service, which checks the permission: non-admins get 403
 * (and 401 when signed out). The ledger views are the payments feature's (/api/admin/ledger…).
 */
export function adminRoutes(ctx: AppContext): Router {
  const admin = createAdminService({ db: ctx.db, lucia: ctx.lucia });
  const disputes = disputesFor(ctx);
  const disputeCase = createDisputeCase({ db: ctx.db, disputes });
  const audit = createAuditService({ db: ctx.db });
  const r = Router();
  // 401 signed out, 403 for everyone but admins, before any input is parsed (services check the exact permission).
  r.use('/admin', requirePermission('read:booking:any', 'The admin desk is for admins only'));

  r.get('/admin/disputes', validateQuery(disputesQuerySchema), (_req, res) => {
    res.json(disputes.list(requireUser(res), queryOf(res, disputesQuerySchema).status));
  });

  r.get('/admin/disputes/:id', (req, res) => {
    res.json({ case: disputeCase.get(requireUser(res), idOf(req)) });
  });

  r.post('/admin/disputes/:id/preview', validateBody(previewSettlementInputSchema), (req, res) => {
    res.json({ preview: disputes.preview(requireUser(res), idOf(req), bodyOf(res, previewSettlementInputSchema)) });
  });

  r.post('/admin/disputes/:id/settle', validateBody(settleDisputeInputSchema), async (req, res) => {
    const result = await disputes.settle(requireUser(res), idOf(req), bodyOf(res, settleDisputeInputSchema));
    // 202 when the processor did not answer in time: the decision stands and a job finishes it.
    res.status(result.dispute.status === 'settled' ? 200 : 202).json(result);
  });

  r.get('/admin/accounts', validateQuery(adminAccountsQuerySchema), (_req, res) => {
    res.json(admin.accounts(requireUser(res), queryOf(res, adminAccountsQuerySchema)));
  });

  r.post('/admin/accounts/:id/disable', validateBody(accountActionInputSchema), async (req, res) => {
    res.json({ account: await admin.disable(requireUser(res), idOf(req), bodyOf(res, accountActionInputSchema)) });
  });

  r.post('/admin/accounts/:id/enable', validateBody(accountActionInputSchema), (req, res) => {
    res.json({ account: admin.enable(requireUser(res), idOf(req), bodyOf(res, accountActionInputSchema)) });
  });

  r.post('/admin/accounts/:id/grant-admin', validateBody(accountActionInputSchema), (req, res) => {
    res.json({ account: admin.grantAdmin(requireUser(res), idOf(req), bodyOf(res, accountActionInputSchema)) });
  });

  r.get('/admin/bookings', validateQuery(adminBookingsQuerySchema), (_req, res) => {
    res.json(admin.bookings(requireUser(res), queryOf(res, adminBookingsQuerySchema)));
  });

  r.get('/admin/audit', validateQuery(auditQuerySchema), (_req, res) => {
    res.json(audit.list(requireUser(res), queryOf(res, auditQuerySchema)));
  });

  return r;
}
