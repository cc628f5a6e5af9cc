// Dividing an amount into parts that always add up to the whole (DESIGN.md, Money: largest-remainder
// rounding). Used for dispute splits, commission between payees, and anywhere one total becomes several.
import { parseDecimalNumber, rescale } from './decimal';
import { assertNonNegativeInteger, MoneyError } from './errors';

/** Weights as exact integers on one common decimal scale, so the arithmetic below is exact. */
function exactWeights(weights: number[]): bigint[] {
  if (!Array.isArray(weights) || weights.length === 0) {
    throw new MoneyError('invalid_weights', 'A split needs at least one weight');
  }
  const decimals = weights.map((weight, index) => {
    if (typeof weight !== 'number' || !Number.isFinite(weight) || weight < 0) {
      throw new MoneyError('invalid_weights', `Weight ${index + 1} must be a finite number of at least 0, got ${String(weight)}`);
    }
    return parseDecimalNumber(weight);
  });
  const scale = Math.max(...decimals.map((decimal) => decimal.scale));
  const scaled = decimals.map((decimal) => rescale(decimal, scale));
  if (scaled.every((weight) => weight === 0n)) {
    throw new MoneyError('invalid_weights', 'At least one weight must be above 0');
  }
  return scaled;
}

/**
 * Splits `total` minor units in proportion to `weights`. Each part is the floor of its exact share;
 * the units left over go one each to the parts with the largest remainders. Ties go to the earlier
 * position, so the same input always gives the same split. Every part is within 1 of its exact share
 * and the parts add up to `total`.
 */
export function splitLargestRemainder(total: number, weights: number[]): number[] {
  assertNonNegativeInteger(total, 'The total to split');
  const exact = exactWeights(weights);
  const weightSum = exact.reduce((sum, weight) => sum + weight, 0n);
  const whole = BigInt(total);

  const floors = exact.map((weight) => (whole * weight) / weightSum);
  const remainders = exact.map((weight) => (whole * weight) % weightSum);
  let leftover = Number(whole - floors.reduce((sum, part) => sum + part, 0n));

  const byRemainder = remainders
    .map((remainder, index) => ({ remainder, index }))
    .sort((a, b) => (a.remainder === b.remainder ? a.index - b.index : a.remainder > b.remainder ? -1 : 1));
  const parts = floors.map(Number);
  for (const { index } of byRemainder) {
    if (leftover === 0) break;
    parts[index] += 1;
    leftover -= 1;
  }
  return parts;
}

/**
 * Splits by percentages that must add up to exactly 100 (e.g. a dispute settled 70/30). Decimals are
 * allowed ([33.33, 33.33, 33.34]); they are compared exactly, so [33.3, 33.3, 33.3] is refused.
 */
export function splitByPercent(total: number, percents: number[]): number[] {
  const exact = exactWeights(percents);
  const scale = Math.max(...percents.map((percent) => parseDecimalNumber(percent).scale));
  const hundred = 100n * 10n ** BigInt(scale);
  const sum = exact.reduce((acc, percent) => acc + percent, 0n);
  if (sum !== hundred) {
    throw new MoneyError('invalid_percents', `Percentages must add up to 100, got ${percents.join(' + ')}`);
  }
  return splitLargestRemainder(total, percents);
}
