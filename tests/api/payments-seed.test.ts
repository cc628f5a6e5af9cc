import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from './helpers/test-app';
import { bookings } from '../../server/db/schema';
import { createLedger } from '../../server/features/ledger/ledger.service';

let app: TestApp;

beforeAll(async () => {
  app = await startTestApp({ seed: true });
}, 120_000);
afterAll(async () => {
  await app?.close();
});

describe('demo money', () => {
  it('seeds funded, delivered and paid-out bookings whose ledger reconciles with the processor', async () => {
    const statuses = app.db.select({ status: bookings.status }).from(bookings).all().map((b) => b.status);
    expect(statuses).toEqual(expect.arrayContaining(['awaiting_payment', 'funded', 'delivered', 'paid_out']));
    const ledger = createLedger(app.db);
    for (const total of ledger.balances().totals) expect(total.sum).toBe(0);
    const recon = await ledger.reconcile(app.kitlane.ctx.stripe);
    expect(recon.differences).toEqual([]);
    expect(recon.transfers.ledgerCount).toBeGreaterThan(0);
  });
});
