import { Router, type Request } from 'express';
import type { AppContext } from '../../app';
import { assertCan, requirePermission, requireSignedIn, requireUser } from '../../auth/middleware';
import { bodyOf, validateBody } from '../../http/validate';
import { checkoutSyncInputSchema, refundInputSchema, releaseInputSchema, splitInputSchema } from '@shared/schemas/payments';
import { paymentsRepo } from './payments.repository';
import { createLedger } from '../ledger/ledger.service';
import { escrowFor, loadVisible, REPAIR_JOB } from './escrow.service';
import { bookingMoneyView } from './money-view';
import { createPayoutAccounts } from './payout-accounts.service';
import { receiveWebhook } from './webhooks';
import { AUTO_ACCEPT_JOB } from './auto-accept';

const idOf = (req: Request) => String(req.params.id);

export function paymentsRoutes(ctx: AppContext): Router {
  const escrow = escrowFor(ctx);
  const payouts = createPayoutAccounts(ctx);
  const ledger = createLedger(ctx.db);
  const r = Router();
  // The webhook is signed by the processor, not a session: it stays outside these paths.
  r.use(['/bookings', '/payouts'], requireSignedIn);
  r.use('/admin/ledger', requirePermission('read:ledger:any'));

  ctx.jobs.register(REPAIR_JOB, async () => {
    await escrow.repairIntents();
  });
  ctx.jobs.register(AUTO_ACCEPT_JOB, async (payload: { bookingId: string; dueAt: number }) => {
    await escrow.autoAccept(payload.bookingId, payload.dueAt);
  });
  // On every start: finish movements a previous run left between the processor call and the ledger write.
  ctx.jobs.enqueue(REPAIR_JOB, { reason: 'startup' });

  // The body here is the raw Buffer (app.ts mounts express.raw for this path before express.json).
  r.post('/webhooks/stripe', async (req, res) => {
    res.json(await receiveWebhook(ctx, req.body, req.get('stripe-signature')));
  });

  r.get('/bookings/:id/money', (req, res) => {
    res.json({ money: bookingMoneyView(ctx.db, requireUser(res), idOf(req)) });
  });

  r.get('/bookings/:id/ledger', (req, res) => {
    const booking = loadVisible(ctx.db, requireUser(res), idOf(req));
    res.json({ ledger: ledger.bookingLedger(booking.id) });
  });

  r.post('/bookings/:id/checkout', async (req, res) => {
    res.status(201).json(await escrow.startCheckout(requireUser(res), idOf(req)));
  });

  r.post('/bookings/:id/add-on/checkout', async (req, res) => {
    res.status(201).json(await escrow.payAddOn(requireUser(res), idOf(req)));
  });

  // The success page asks once; the webhook is what funds the booking, this only reads the same state sooner.
  r.post('/bookings/:id/checkout/sync', validateBody(checkoutSyncInputSchema), async (req, res) => {
    const user = requireUser(res);
    const booking = loadVisible(ctx.db, user, idOf(req));
    const { sessionId } = bodyOf(res, checkoutSyncInputSchema);
    if (paymentsRepo.paymentBySession(ctx.db, sessionId)?.bookingId === booking.id) await escrow.syncCheckoutSession(sessionId);
    res.json({ money: bookingMoneyView(ctx.db, user, booking.id) });
  });

  r.post('/bookings/:id/release', validateBody(releaseInputSchema), async (req, res) => {
    res.json(await escrow.releaseBooking(requireUser(res), idOf(req), bodyOf(res, releaseInputSchema)));
  });

  r.post('/bookings/:id/refund', validateBody(refundInputSchema), async (req, res) => {
    res.json(await escrow.refundBooking(requireUser(res), idOf(req), bodyOf(res, refundInputSchema)));
  });

  r.post('/bookings/:id/split', validateBody(splitInputSchema), async (req, res) => {
    res.json(await escrow.splitBooking(requireUser(res), idOf(req), bodyOf(res, splitInputSchema)));
  });

  r.post('/bookings/:id/cancel', async (req, res) => {
    res.json(await escrow.cancelBooking(requireUser(res), idOf(req)));
  });

  r.get('/payouts/account', (_req, res) => {
    res.json({ account: payouts.view(requireUser(res)) });
  });

  r.post('/payouts/account/onboarding', async (_req, res) => {
    res.status(201).json(await payouts.onboardingLink(requireUser(res)));
  });

  r.post('/payouts/account/refresh', async (_req, res) => {
    res.json({ account: await payouts.refresh(requireUser(res)) });
  });

  r.get('/admin/ledger', (_req, res) => {
    assertCan(requireUser(res), 'read:ledger:any');
    res.json({ ledger: ledger.balances() });
  });

  r.get('/admin/ledger/reconcile', async (_req, res) => {
    assertCan(requireUser(res), 'read:ledger:any');
    res.json({ reconciliation: await ledger.reconcile(ctx.stripe) });
  });

  return r;
}
