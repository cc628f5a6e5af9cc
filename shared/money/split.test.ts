import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { MoneyError } from './errors';
import { splitByPercent, splitLargestRemainder } from './split';

function codeOf(fn: () => unknown): string | undefined {
  try {
    fn();
  } catch (error) {
    if (error instanceof MoneyError) return error.code;
    throw error;
  }
  return undefined;
}

const weightsArb = fc
  .array(fc.integer({ min: 0, max: 1_000_000 }), { minLength: 1, maxLength: 12 })
  .filter((weights) => weights.some((weight) => weight > 0));

describe('splitLargestRemainder', () => {
  // Expected values below are worked by hand: floors first, then the leftover units by remainder.
  it('gives the leftover cent to the largest remainder', () => {
    // 1000 × 2/7 = 285.71, × 5/7 = 714.28: floors 285 + 714 = 999, the .71 gets the last unit.
    expect(splitLargestRemainder(1000, [2, 5])).toEqual([286, 714]);
  });

  it('breaks ties toward the earlier part, the same way every time', () => {
    expect(splitLargestRemainder(100, [1, 1, 1])).toEqual([34, 33, 33]);
    expect(splitLargestRemainder(2, [1, 1, 1])).toEqual([1, 1, 0]);
    expect(splitLargestRemainder(1, [3, 3])).toEqual([1, 0]);
  });

  it('gives nothing to a zero weight and everything to a single weight', () => {
    expect(splitLargestRemainder(999, [0, 1, 0])).toEqual([0, 999, 0]);
    expect(splitLargestRemainder(12345, [7])).toEqual([12345]);
    expect(splitLargestRemainder(0, [1, 2])).toEqual([0, 0]);
  });

  it('accepts decimal weights and reads them as the decimals written', () => {
    // 0.1 : 0.2 : 0.7 of 10 is 1 : 2 : 7 exactly, with no floating-point drift.
    expect(splitLargestRemainder(10, [0.1, 0.2, 0.7])).toEqual([1, 2, 7]);
  });

  it('refuses negative or fractional totals and bad weights', () => {
    expect(codeOf(() => splitLargestRemainder(-1, [1]))).toBe('invalid_amount');
    expect(codeOf(() => splitLargestRemainder(10.5, [1]))).toBe('invalid_amount');
    expect(codeOf(() => splitLargestRemainder(10, []))).toBe('invalid_weights');
    expect(codeOf(() => splitLargestRemainder(10, [0, 0]))).toBe('invalid_weights');
    expect(codeOf(() => splitLargestRemainder(10, [1, -1]))).toBe('invalid_weights');
    expect(codeOf(() => splitLargestRemainder(10, [1, Number.POSITIVE_INFINITY]))).toBe('invalid_weights');
  });

  it('always returns integer parts that add up to the whole and sit within 1 of the exact share', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 99_999_999 }), weightsArb, (total, weights) => {
        const parts = splitLargestRemainder(total, weights);
        expect(parts).toHaveLength(weights.length);
        expect(parts.every(Number.isSafeInteger)).toBe(true);
        expect(parts.reduce((a, b) => a + b, 0)).toBe(total);
        // |part − total·w/W| < 1, compared exactly as |part·W − total·w| < W.
        const weightSum = BigInt(weights.reduce((a, b) => a + b, 0));
        parts.forEach((part, i) => {
          const gap = BigInt(part) * weightSum - BigInt(total) * BigInt(weights[i]);
          expect(gap < 0n ? -gap : gap).toBeLessThan(weightSum);
        });
      }),
    );
  });

  it('hands the leftover units only to parts whose remainder is at least as large as any part passed over', () => {
    // Small weights make equal and zero remainders common, where a wrong allocation shows.
    const smallWeights = fc.array(fc.integer({ min: 0, max: 4 }), { minLength: 1, maxLength: 8 }).filter((w) => w.some((x) => x > 0));
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 1000 }), smallWeights, (total, weights) => {
        const parts = splitLargestRemainder(total, weights);
        const weightSum = weights.reduce((a, b) => a + b, 0);
        const floors = weights.map((w) => Math.floor((total * w) / weightSum));
        const remainders = weights.map((w) => (total * w) % weightSum);
        const raised = parts.map((part, i) => part - floors[i]);
        expect(raised.every((extra) => extra === 0 || extra === 1)).toBe(true);
        raised.forEach((extra, i) => {
          if (extra === 0) return;
          raised.forEach((other, j) => {
            if (other === 0) expect(remainders[i]).toBeGreaterThanOrEqual(remainders[j]);
          });
        });
      }),
    );
  });

  it('does not depend on how the weights are scaled', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 99_999_999 }), weightsArb, fc.integer({ min: 2, max: 1000 }), (total, weights, factor) => {
        expect(splitLargestRemainder(total, weights.map((w) => w * factor))).toEqual(splitLargestRemainder(total, weights));
      }),
    );
  });
});

describe('splitByPercent', () => {
  it('splits a settled dispute 70/30', () => {
    expect(splitByPercent(42_000, [70, 30])).toEqual([29_400, 12_600]);
    expect(splitByPercent(999, [70, 30])).toEqual([699, 300]); // 699.3 and 299.7: the .7 gets the unit
  });

  it('accepts decimal percentages that add up to exactly 100', () => {
    expect(splitByPercent(10_000, [33.33, 33.33, 33.34])).toEqual([3333, 3333, 3334]);
  });

  it('refuses percentages that do not add up to exactly 100', () => {
    expect(codeOf(() => splitByPercent(100, [70, 20]))).toBe('invalid_percents');
    expect(codeOf(() => splitByPercent(100, [33.3, 33.3, 33.3]))).toBe('invalid_percents');
    expect(codeOf(() => splitByPercent(100, [101, -1]))).toBe('invalid_weights');
  });

  it('always adds up to the whole for any two-way split in whole percent', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 99_999_999 }), fc.integer({ min: 0, max: 100 }), (total, first) => {
        const [a, b] = splitByPercent(total, [first, 100 - first]);
        expect(a + b).toBe(total);
        expect(Math.abs(a * 100 - total * first)).toBeLessThan(100);
      }),
    );
  });
});
