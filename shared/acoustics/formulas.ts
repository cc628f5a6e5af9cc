// The textbook formulas behind the room estimate, each as a small pure function so the reference
// tests can check them one by one against REFERENCES.md (Acoustics and safety, from memory).

/** Metric Sabine/Eyring constant in s/m: 24·ln(10)/c evaluated near 343 m/s, as REFERENCES.md writes it. */
export const SABINE_CONSTANT = 0.161;

/**
 * Eyring's ln(1 − ᾱ) is infinite at ᾱ = 1 (a room of open windows), so coefficients are capped just
 * below 1 before the log. 0.99 keeps a fully absorbing surface finite and still dominant.
 */
export const EYRING_COEFFICIENT_CAP = 0.99;

/** Speed of sound in air, m/s: c ≈ 331.3 + 0.606·T(°C) (REFERENCES.md; 343 m/s at 20 °C). */
export function speedOfSound(tempC: number): number {
  assertFinite(tempC, 'temperature');
  return 331.3 + 0.606 * tempC;
}

/** Sabine RT60 in seconds: 0.161·V/A, V in m³, A = Σ Sᵢ·αᵢ in m² (metric sabins). */
export function sabineRt60(volumeM3: number, absorptionAreaM2: number): number {
  assertPositive(volumeM3, 'volume');
  assertPositive(absorptionAreaM2, 'absorption area');
  return (SABINE_CONSTANT * volumeM3) / absorptionAreaM2;
}

/** Eyring RT60 in seconds: 0.161·V / (−S·ln(1 − ᾱ)); ᾱ is capped at EYRING_COEFFICIENT_CAP. */
export function eyringRt60(volumeM3: number, surfaceM2: number, averageAbsorption: number): number {
  assertPositive(volumeM3, 'volume');
  assertPositive(surfaceM2, 'surface');
  if (!(averageAbsorption > 0 && averageAbsorption <= 1)) {
    throw new RangeError(`average absorption must be in (0, 1], got ${averageAbsorption}`);
  }
  const alpha = Math.min(averageAbsorption, EYRING_COEFFICIENT_CAP);
  return (SABINE_CONSTANT * volumeM3) / (-surfaceM2 * Math.log(1 - alpha));
}

/** Axial mode n of one dimension: f = n·c/(2L). */
export function axialModeHz(order: number, lengthM: number, speedMs: number): number {
  if (!Number.isInteger(order) || order < 1) throw new RangeError(`mode order must be a whole number ≥ 1, got ${order}`);
  assertPositive(lengthM, 'length');
  assertPositive(speedMs, 'speed of sound');
  return (order * speedMs) / (2 * lengthM);
}

/** Schroeder frequency in Hz: ≈ 2000·√(RT60/V); below it single modes dominate the room's sound. */
export function schroederFrequency(rt60Sec: number, volumeM3: number): number {
  assertPositive(rt60Sec, 'RT60');
  assertPositive(volumeM3, 'volume');
  return 2000 * Math.sqrt(rt60Sec / volumeM3);
}

function assertFinite(value: number, what: string): void {
  if (!Number.isFinite(value)) throw new RangeError(`${what} must be a finite number, got ${value}`);
}

function assertPositive(value: number, what: string): void {
  if (!(Number.isFinite(value) && value > 0)) throw new RangeError(`${what} must be a positive number, got ${value}`);
}
