// Biquad designs used by the meters. Coefficients are normalised so a0 = 1 and applied in
// transposed direct form II (y = b0·x + s1; s1 = b1·x − a1·y + s2; s2 = b2·x − a2·y).

export interface Biquad {
  b0: number;
  b1: number;
  b2: number;
  a1: number;
  a2: number;
}

// K-weighting analog prototypes (ITU-R BS.1770 Annex 1, as re-derived in REFERENCES.md): applying the
// bilinear transform with K = tan(π·f0/fs) reproduces the published 48 kHz tables and gives the same
// response at any other rate.
const SHELF_F0 = 1681.974450955533;
const SHELF_GAIN_DB = 3.999843853973347;
const SHELF_Q = 0.7071752369554196;
// Exponent splitting the shelf gain between the two zeros of the published design.
const SHELF_VB_EXPONENT = 0.4996667741545416;
const HIGHPASS_F0 = 38.13547087602444;
const HIGHPASS_Q = 0.5003270373238773;

export function kWeightingShelf(sampleRate: number): Biquad {
  const k = Math.tan((Math.PI * SHELF_F0) / sampleRate);
  const vh = Math.pow(10, SHELF_GAIN_DB / 20);
  const vb = Math.pow(vh, SHELF_VB_EXPONENT);
  const a0 = 1 + k / SHELF_Q + k * k;
  return {
    b0: (vh + (vb * k) / SHELF_Q + k * k) / a0,
    b1: (2 * (k * k - vh)) / a0,
    b2: (vh - (vb * k) / SHELF_Q + k * k) / a0,
    a1: (2 * (k * k - 1)) / a0,
    a2: (1 - k / SHELF_Q + k * k) / a0,
  };
}

// The published stage 2 keeps b = [1, −2, 1] un-normalised (its gain at high frequencies is ~1.0
// only because a1, a2 are close to the normalised ones); we follow the table exactly.
export function kWeightingHighPass(sampleRate: number): Biquad {
  const k = Math.tan((Math.PI * HIGHPASS_F0) / sampleRate);
  const a0 = 1 + k / HIGHPASS_Q + k * k;
  return { b0: 1, b1: -2, b2: 1, a1: (2 * (k * k - 1)) / a0, a2: (1 - k / HIGHPASS_Q + k * k) / a0 };
}

// Second-order sections of an order-2n Butterworth filter: Q_k = 1 / (2·cos((2k−1)·π/(4n))).
export function butterworthQs(order: number): number[] {
  const qs: number[] = [];
  for (let k = 1; k <= order / 2; k++) qs.push(1 / (2 * Math.cos(((2 * k - 1) * Math.PI) / (2 * order))));
  return qs;
}

// Bilinear-transform low/high-pass sections (the common "audio EQ cookbook" forms). 1 − cos w is
// written 2·sin²(w/2) so very low corner frequencies keep their precision.
export function lowPass(sampleRate: number, cutoff: number, q: number): Biquad {
  const w = (2 * Math.PI * cutoff) / sampleRate;
  const alpha = Math.sin(w) / (2 * q);
  const oneMinusCos = 2 * Math.sin(w / 2) ** 2;
  const a0 = 1 + alpha;
  return {
    b0: oneMinusCos / 2 / a0,
    b1: oneMinusCos / a0,
    b2: oneMinusCos / 2 / a0,
    a1: (-2 * Math.cos(w)) / a0,
    a2: (1 - alpha) / a0,
  };
}

export function highPass(sampleRate: number, cutoff: number, q: number): Biquad {
  const w = (2 * Math.PI * cutoff) / sampleRate;
  const alpha = Math.sin(w) / (2 * q);
  const onePlusCos = 1 + Math.cos(w);
  const a0 = 1 + alpha;
  return {
    b0: onePlusCos / 2 / a0,
    b1: -onePlusCos / a0,
    b2: onePlusCos / 2 / a0,
    a1: (-2 * Math.cos(w)) / a0,
    a2: (1 - alpha) / a0,
  };
}

export function butterworthLowPass(sampleRate: number, cutoff: number, order: number): Biquad[] {
  return butterworthQs(order).map((q) => lowPass(sampleRate, cutoff, q));
}

export function butterworthHighPass(sampleRate: number, cutoff: number, order: number): Biquad[] {
  return butterworthQs(order).map((q) => highPass(sampleRate, cutoff, q));
}

/** Runs a cascade over `x` in place, from a zero state (used on short windows, not in the hot path). */
export function filterInPlace(x: Float32Array | Float64Array, sections: Biquad[]): void {
  for (const { b0, b1, b2, a1, a2 } of sections) {
    let s1 = 0;
    let s2 = 0;
    for (let i = 0; i < x.length; i++) {
      const v = x[i];
      const y = b0 * v + s1;
      s1 = b1 * v - a1 * y + s2;
      s2 = b2 * v - a2 * y;
      x[i] = y;
    }
  }
}

/** Magnitude response of a cascade at `freq` (used by tests to check designs against their spec). */
export function magnitudeAt(sections: Biquad[], sampleRate: number, freq: number): number {
  const w = (2 * Math.PI * freq) / sampleRate;
  let gain = 1;
  for (const { b0, b1, b2, a1, a2 } of sections) {
    const numRe = b0 + b1 * Math.cos(-w) + b2 * Math.cos(-2 * w);
    const numIm = b1 * Math.sin(-w) + b2 * Math.sin(-2 * w);
    const denRe = 1 + a1 * Math.cos(-w) + a2 * Math.cos(-2 * w);
    const denIm = a1 * Math.sin(-w) + a2 * Math.sin(-2 * w);
    gain *= Math.hypot(numRe, numIm) / Math.hypot(denRe, denIm);
  }
  return gain;
}
