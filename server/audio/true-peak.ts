// True peak per ITU-R BS.1770 Annex 2: oversample (4× below 88.2 kHz, 2× at 88.2/96 kHz, none from
// 176.4 kHz), interpolate with the annex's 48-tap, 4-phase FIR, take the largest |value|.
// y[4m + p] = Σ_k h_p[k] · x[m − k], k = 0..11.
//
// Speed: an interpolated value can never exceed (largest |x| in its 12-sample window) × Σ|h_p|
// (REFERENCES.md, "exactness trick"). We keep the largest |x| per 32-sample sub-block and only run the
// FIR where that bound could beat the running maximum, which starts at the sample peak (the true peak
// is reported as max(sample peak, interpolated peak), so that start never changes the result).

export const TRUE_PEAK_PHASES: readonly (readonly number[])[] = [
  [0.001708984375, 0.010986328125, -0.0196533203125, 0.033203125, -0.0594482421875, 0.1373291015625, 0.97216796875, -0.102294921875, 0.047607421875, -0.026611328125, 0.014892578125, -0.00830078125],
  [-0.0291748046875, 0.029296875, -0.0517578125, 0.0891113281250, -0.166503906250, 0.465087890625, 0.779785156250, -0.2003173828125, 0.1015625, -0.0582275390625, 0.0330810546875, -0.0189208984375],
  [-0.0189208984375, 0.0330810546875, -0.0582275390625, 0.1015625, -0.2003173828125, 0.779785156250, 0.465087890625, -0.166503906250, 0.0891113281250, -0.0517578125, 0.029296875, -0.0291748046875],
  [-0.00830078125, 0.014892578125, -0.026611328125, 0.047607421875, -0.102294921875, 0.97216796875, 0.1373291015625, -0.0594482421875, 0.033203125, -0.0196533203125, 0.010986328125, 0.001708984375],
];

/** Samples of history each interpolated value needs before the current one. */
export const TRUE_PEAK_HISTORY = 11;
export const SUB_BLOCK = 32;

export type Oversampling = 1 | 2 | 4;

export function oversamplingFor(sampleRate: number): Oversampling {
  if (sampleRate >= 176_400) return 1;
  if (sampleRate >= 88_200) return 2;
  return 4;
}

function phaseAbsSum(phase: readonly number[]): number {
  return phase.reduce((sum, tap) => sum + Math.abs(tap), 0);
}

/** The skip bound's gain: the largest Σ|h_p| over the phases in use. */
export function boundGain(oversampling: Oversampling): number {
  if (oversampling === 1) return 1;
  const phases = oversampling === 4 ? TRUE_PEAK_PHASES : [TRUE_PEAK_PHASES[0], TRUE_PEAK_PHASES[2]];
  return Math.max(...phases.map(phaseAbsSum));
}

const [P0, P1, P2, P3] = TRUE_PEAK_PHASES;
const a0 = P0[0], a1 = P0[1], a2 = P0[2], a3 = P0[3], a4 = P0[4], a5 = P0[5], a6 = P0[6], a7 = P0[7], a8 = P0[8], a9 = P0[9], a10 = P0[10], a11 = P0[11];
const b0 = P1[0], b1 = P1[1], b2 = P1[2], b3 = P1[3], b4 = P1[4], b5 = P1[5], b6 = P1[6], b7 = P1[7], b8 = P1[8], b9 = P1[9], b10 = P1[10], b11 = P1[11];
const c0 = P2[0], c1 = P2[1], c2 = P2[2], c3 = P2[3], c4 = P2[4], c5 = P2[5], c6 = P2[6], c7 = P2[7], c8 = P2[8], c9 = P2[9], c10 = P2[10], c11 = P2[11];
const d0 = P3[0], d1 = P3[1], d2 = P3[2], d3 = P3[3], d4 = P3[4], d5 = P3[5], d6 = P3[6], d7 = P3[7], d8 = P3[8], d9 = P3[9], d10 = P3[10], d11 = P3[11];

/**
 * Largest |interpolated value| for the outputs of samples x[from..to) (each needs x[m−11..m]; the
 * caller guarantees from ≥ 11). 4 phases, or phases 0 and 2 when `twoPhase` (2× oversampling).
 */
export function interpolatedPeak(x: Float32Array, from: number, to: number, twoPhase: boolean): number {
  let peak = 0;
  // Sliding window in locals: x0 is x[m], x11 is x[m−11].
  let x1 = x[from - 1], x2 = x[from - 2], x3 = x[from - 3], x4 = x[from - 4], x5 = x[from - 5], x6 = x[from - 6];
  let x7 = x[from - 7], x8 = x[from - 8], x9 = x[from - 9], x10 = x[from - 10], x11 = x[from - 11];
  for (let m = from; m < to; m++) {
    const x0 = x[m];
    let y = a0 * x0 + a1 * x1 + a2 * x2 + a3 * x3 + a4 * x4 + a5 * x5 + a6 * x6 + a7 * x7 + a8 * x8 + a9 * x9 + a10 * x10 + a11 * x11;
    if (y < 0) y = -y;
    if (y > peak) peak = y;
    y = c0 * x0 + c1 * x1 + c2 * x2 + c3 * x3 + c4 * x4 + c5 * x5 + c6 * x6 + c7 * x7 + c8 * x8 + c9 * x9 + c10 * x10 + c11 * x11;
    if (y < 0) y = -y;
    if (y > peak) peak = y;
    if (!twoPhase) {
      y = b0 * x0 + b1 * x1 + b2 * x2 + b3 * x3 + b4 * x4 + b5 * x5 + b6 * x6 + b7 * x7 + b8 * x8 + b9 * x9 + b10 * x10 + b11 * x11;
      if (y < 0) y = -y;
      if (y > peak) peak = y;
      y = d0 * x0 + d1 * x1 + d2 * x2 + d3 * x3 + d4 * x4 + d5 * x5 + d6 * x6 + d7 * x7 + d8 * x8 + d9 * x9 + d10 * x10 + d11 * x11;
      if (y < 0) y = -y;
      if (y > peak) peak = y;
    }
    x11 = x10; x10 = x9; x9 = x8; x8 = x7; x7 = x6; x6 = x5; x5 = x4; x4 = x3; x3 = x2; x2 = x1; x1 = x0;
  }
  return peak;
}

/**
 * One channel's true-peak state across blocks. The caller's buffer holds TRUE_PEAK_HISTORY samples of
 * history in front of each block; `subMax[j]` is the largest |x| of the block's j-th 32-sample sub-block.
 */
export class TruePeakMeter {
  readonly oversampling: Oversampling;
  private readonly gain: number;
  private peak = 0;
  private historyMax = 0;
  /** Sub-blocks whose bound let them be skipped, for the bench and tests. */
  skipped = 0;
  evaluated = 0;

  constructor(sampleRate: number) {
    this.oversampling = oversamplingFor(sampleRate);
    this.gain = boundGain(this.oversampling);
  }

  /** `floor` is the sample peak so far: windows whose bound cannot exceed it are skipped. */
  process(x: Float32Array, frames: number, subMax: Float32Array, floor: number): void {
    if (this.oversampling === 1) return;
    if (floor > this.peak) this.peak = floor;
    const twoPhase = this.oversampling === 2;
    const subBlocks = Math.ceil(frames / SUB_BLOCK);
    let previous = this.historyMax;
    let beforePrevious = this.historyMax;
    for (let j = 0; j < subBlocks; j++) {
      const own = subMax[j];
      const windowMax = own > previous ? own : previous;
      beforePrevious = previous;
      previous = own;
      if (windowMax * this.gain <= this.peak) {
        this.skipped++;
        continue;
      }
      this.evaluated++;
      const from = TRUE_PEAK_HISTORY + j * SUB_BLOCK;
      const to = Math.min(TRUE_PEAK_HISTORY + frames, from + SUB_BLOCK);
      const value = interpolatedPeak(x, from, to, twoPhase);
      if (value > this.peak) this.peak = value;
    }
    // The next block's 11 history samples may reach back into the last two sub-blocks.
    this.historyMax = frames % SUB_BLOCK !== 0 && frames % SUB_BLOCK < TRUE_PEAK_HISTORY ? Math.max(previous, beforePrevious) : previous;
  }

  /** The result given the final sample peak (true peak is never below it). */
  result(samplePeak: number): number {
    return Math.max(this.peak, samplePeak);
  }
}
