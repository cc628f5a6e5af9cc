import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { onboardedAccount, paidCheckout, sdkFor, startTestFake, tempStateFile } from './test-support';

describe('restart safety', () => {
  const cleanups: Array<() => void> = [];
  afterEach(() => cleanups.splice(0).forEach((cleanup) => cleanup()));

  it('keeps sessions, charges, balances, transfers and idempotency keys after close and start on the same file', async () => {
    const temp = tempStateFile();
    cleanups.push(temp.cleanup);
    let fake = await startTestFake({ stateFile: temp.file });
    let stripe = sdkFor(fake);
    const { sessionId, chargeId } = await paidCheckout(fake, stripe, 10_000, 'usd', 'booking_r1');
    const drummer = await onboardedAccount(fake, stripe);
    const params = { amount: 7_000, currency: 'usd', destination: drummer, source_transaction: chargeId };
    const transfer = await stripe.transfers.create(params, { idempotencyKey: 'release-r1' });
    await fake.close();

    expect(existsSync(temp.file)).toBe(true);
    // Atomic writes leave no temp files behind.
    expect(readdirSync(dirname(temp.file)).filter((name) => name.endsWith('.tmp'))).toEqual([]);
    expect(JSON.parse(readFileSync(temp.file, 'utf8')).version).toBe(1);

    fake = await startTestFake({ stateFile: temp.file });
    stripe = sdkFor(fake);
    try {
      const session = await stripe.checkout.sessions.retrieve(sessionId);
      expect(session.status).toBe('complete');
      expect((await stripe.charges.retrieve(chargeId)).amount).toBe(10_000);
      expect((await stripe.transfers.retrieve(transfer.id)).destination).toBe(drummer);
      expect((await stripe.balance.retrieve()).available[0].amount).toBe(3_000);
      expect((await stripe.balance.retrieve({}, { stripeAccount: drummer })).available[0].amount).toBe(7_000);
      const replay = await stripe.transfers.create(params, { idempotencyKey: 'release-r1' });
      expect(replay.id).toBe(transfer.id);
      expect((await stripe.transfers.list()).data).toHaveLength(1);
    } finally {
      await fake.close();
    }
  });
});
