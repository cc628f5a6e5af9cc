import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { allocateAcrossCharges, planOutcome, refundForPercent } from './escrow-rules';

describe('escrow outcome arithmetic', () => {
  it('refunds 70 % of 333.33 as 233.33 and releases the rest less 10 % commission', () => {
    const refund = refundForPercent(33_333, 70);
    expect(refund).toBe(23_333);
    const plan = planOutcome(33_333, refund, { drummer: 33_333, engineer: 0 }, 'USD');
    expect(plan).toMatchObject({ releasedMinor: 10_000, commissionMinor: 1_000, drummer: { gross: 10_000, commission: 1_000, net: 9_000 } });
  });

  it('adds up exactly for any held amount, refund and share of the work (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 99_999_999 }), fc.double({ min: 0, max: 1, noNaN: true }), fc.integer({ min: 1, max: 1_000_000 }), fc.integer({ min: 0, max: 1_000_000 }), (held, part, drummer, engineer) => {
        const refund = Math.floor(held * part);
        const plan = planOutcome(held, refund, { drummer, engineer }, 'EUR');
        expect(plan.refundMinor + plan.drummer.net + plan.engineer.net + plan.commissionMinor).toBe(held);
        expect(plan.drummer.net).toBeGreaterThanOrEqual(0);
        expect(plan.engineer.net).toBeGreaterThanOrEqual(0);
        if (engineer === 0) expect(plan.engineer.gross).toBe(0);
      }),
    );
  });

  it('gives every percentage split parts that add up to what is held (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 99_999_999 }), fc.integer({ min: 0, max: 10_000 }), (held, hundredths) => {
        const refund = refundForPercent(held, hundredths / 100);
        expect(refund).toBeGreaterThanOrEqual(0);
        expect(refund).toBeLessThanOrEqual(held);
        expect(Math.abs(refund - (held * hundredths) / 10_000)).toBeLessThanOrEqual(1);
      }),
    );
  });

  it('refuses a refund larger than what is held', () => {
    expect(() => planOutcome(1_000, 1_001, { drummer: 1, engineer: 0 }, 'USD')).toThrow(/between 0 and the 1000/);
  });

  it('spreads a movement over the newest charges first and refuses more than they hold', () => {
    const charges = [
      { chargeId: 'ch_addon', roomMinor: 4_200 },
      { chargeId: 'ch_booking', roomMinor: 31_500 },
    ];
    expect(allocateAcrossCharges(5_000, charges)).toEqual([
      { chargeId: 'ch_addon', amountMinor: 4_200 },
      { chargeId: 'ch_booking', amountMinor: 800 },
    ]);
    expect(() => allocateAcrossCharges(35_701, charges)).toThrow(/35700 minor units left/);
  });
});
