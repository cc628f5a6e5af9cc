import { butterworthLowPass, kWeightingHighPass, kWeightingShelf, type Biquad } from './filters';
import { channelWeights, integratedLoudness, quarterStart } from './loudness';
import { SUB_BLOCK, TRUE_PEAK_HISTORY, TruePeakMeter } from './true-peak';

// All per-stem measures fed from the same decoded Float32 blocks, one channel at a time. Each channel
// buffer carries TRUE_PEAK_HISTORY samples of the previous block in front of the new frames.

export const PEAK_BUCKET = 256;
/** Rumble: energy below this corner (4th-order Butterworth low-pass) relative to the whole. */
export const RUMBLE_CUTOFF_HZ = 30;
const RUMBLE_ORDER = 4;
const CLIP_RUN = 3;
// Filter states this small are flushed to zero so long silences never run on denormal numbers.
const DENORMAL_FLOOR = 1e-25;

export interface StemMeterConfig {
  sampleRate: number;
  channels: number;
  frames: number;
  /** |x| at or above this is full scale: the largest code for integers, 1 − 1e-6 for float. */
  clipThreshold: number;
  channelMask: number | null;
}

export interface StemMeasures {
  samplePeak: number;
  truePeak: number | null;
  integratedLufs: number | null;
  /** Mean square over all channels (a full-scale sine reads 0.5, i.e. −3.01 dBFS). */
  meanSquare: number;
  /** The DC offset of the channel where it is largest, signed. */
  dcOffset: number;
  clippedRuns: number;
  clippedSamples: number;
  /** Energy below 30 Hz relative to the whole, both without DC; null when the stem has no AC energy. */
  rumbleRatio: number | null;
  /** Largest |x| over channels per PEAK_BUCKET frames. */
  peaks: Float32Array;
  truePeakSkippedFraction: number;
}

class ChannelState {
  sum = 0;
  sumSquares = 0;
  peak = 0;
  clipRun = 0;
  clippedRuns = 0;
  clippedSamples = 0;
  lowSum = 0;
  lowSquares = 0;
  quarter = 0;
  // K shelf, K high-pass, rumble section 1, rumble section 2: (s1, s2) each.
  readonly filter = new Float64Array(8);
  readonly truePeak: TruePeakMeter;

  constructor(sampleRate: number) {
    this.truePeak = new TruePeakMeter(sampleRate);
  }
}

function flushDenormals(state: Float64Array): void {
  for (let i = 0; i < state.length; i++) if (Math.abs(state[i]) < DENORMAL_FLOOR) state[i] = 0;
}

interface FilterSet {
  shelf: Biquad;
  highPass: Biquad;
  /** Designed for the sub-block rate (fs / SUB_BLOCK). */
  rumble: [Biquad, Biquad];
}

interface BlockContext {
  subMax: Float32Array;
  subMean: Float64Array;
  peaks: Float32Array;
  firstBucket: number;
  firstFrame: number;
  clip: number;
  filters: FilterSet;
  quarterSums: Float64Array;
  weight: number;
  sampleRate: number;
}

/** Counts finished runs of CLIP_RUN+ full-scale samples inside one sub-block that reached full scale. */
function scanClips(x: Float32Array, start: number, stop: number, clip: number, st: ChannelState): void {
  for (let i = start; i < stop; i++) {
    if (Math.abs(x[i]) >= clip) st.clipRun++;
    else endClipRun(st);
  }
}

function endClipRun(st: ChannelState): void {
  if (st.clipRun >= CLIP_RUN) {
    st.clippedRuns++;
    st.clippedSamples += st.clipRun;
  }
  st.clipRun = 0;
}

/**
 * One sweep per channel block: peak, sums, per-sub-block maxima and means, waveform buckets, and the
 * K-weighting (two sections) into per-100 ms sums. The level arithmetic rides along in the shadow of
 * the filter recursion's latency, so it costs almost nothing extra.
 */
function measureBlock(x: Float32Array, frames: number, st: ChannelState, ctx: BlockContext): void {
  const { b0: kb0, b1: kb1, b2: kb2, a1: ka1, a2: ka2 } = ctx.filters.shelf;
  const { b0: hb0, b1: hb1, b2: hb2, a1: ha1, a2: ha2 } = ctx.filters.highPass;
  const { subMax, subMean, peaks, clip, quarterSums, weight, sampleRate } = ctx;
  const f = st.filter;
  let k1 = f[0], k2 = f[1], h1 = f[2], h2 = f[3];
  let sum = 0;
  let squares = 0;
  let peak = st.peak;
  let energy = 0;
  // Block-relative buffer index where the current 100 ms quarter ends.
  let quarterEnd = TRUE_PEAK_HISTORY + quarterStart(st.quarter + 1, sampleRate) - ctx.firstFrame;
  const end = TRUE_PEAK_HISTORY + frames;
  for (let j = 0, start = TRUE_PEAK_HISTORY; start < end; j++, start += SUB_BLOCK) {
    const stop = start + SUB_BLOCK < end ? start + SUB_BLOCK : end;
    let max = 0;
    let local = 0;
    let localSquares = 0;
    for (let segment = start; segment < stop; ) {
      const segmentEnd = quarterEnd < stop ? quarterEnd : stop;
      for (let i = segment; i < segmentEnd; i++) {
        const v = x[i];
        local += v;
        localSquares += v * v;
        const a = Math.abs(v);
        if (a > max) max = a;
        const k = kb0 * v + k1;
        k1 = kb1 * v - ka1 * k + k2;
        k2 = kb2 * v - ka2 * k;
        const h = hb0 * k + h1;
        h1 = hb1 * k - ha1 * h + h2;
        h2 = hb2 * k - ha2 * h;
        energy += h * h;
      }
      if (segmentEnd === quarterEnd) {
        quarterSums[st.quarter] += weight * energy;
        energy = 0;
        st.quarter++;
        quarterEnd = TRUE_PEAK_HISTORY + quarterStart(st.quarter + 1, sampleRate) - ctx.firstFrame;
        // Long silences must not run on denormal numbers.
        if (Math.abs(k1) < DENORMAL_FLOOR) k1 = 0;
        if (Math.abs(k2) < DENORMAL_FLOOR) k2 = 0;
        if (Math.abs(h1) < DENORMAL_FLOOR) h1 = 0;
        if (Math.abs(h2) < DENORMAL_FLOOR) h2 = 0;
      }
      segment = segmentEnd;
    }
    // Clipping is only possible where the sub-block reaches full scale: scan just those.
    if (max >= clip) scanClips(x, start, stop, clip, st);
    else if (st.clipRun !== 0) endClipRun(st);
    squares += localSquares;
    sum += local;
    subMean[j] = local / (stop - start);
    subMax[j] = max;
    if (max > peak) peak = max;
    const bucket = ctx.firstBucket + ((j * SUB_BLOCK) >> 8);
    if (max > peaks[bucket]) peaks[bucket] = max;
  }
  quarterSums[st.quarter] += weight * energy;
  f[0] = k1; f[1] = k2; f[2] = h1; f[3] = h2;
  st.sum += sum;
  st.sumSquares += squares;
  st.peak = peak;
}

/**
 * Rumble: the 30 Hz low-pass runs on 32-sample means, i.e. at fs/32. A boxcar mean has its nulls at
 * multiples of fs/32, exactly where anything that would alias down to 0–30 Hz sits, so the decimated
 * signal keeps the low band (droop at 30 Hz < 0.01 dB at 48 kHz) for 1/32 of the work.
 */
function rumblePass(subMean: Float64Array, subBlocks: number, frames: number, st: ChannelState, f: FilterSet): void {
  const { b0: rb0, b1: rb1, b2: rb2, a1: ra1, a2: ra2 } = f.rumble[0];
  const { b0: qb0, b1: qb1, b2: qb2, a1: qa1, a2: qa2 } = f.rumble[1];
  const s = st.filter;
  let r1 = s[4], r2 = s[5], q1 = s[6], q2 = s[7];
  let lowSum = 0;
  let lowSquares = 0;
  for (let j = 0; j < subBlocks; j++) {
    const v = subMean[j];
    const r = rb0 * v + r1;
    r1 = rb1 * v - ra1 * r + r2;
    r2 = rb2 * v - ra2 * r;
    const q = qb0 * r + q1;
    q1 = qb1 * r - qa1 * q + q2;
    q2 = qb2 * r - qa2 * q;
    // Each mean stands for SUB_BLOCK samples (fewer in a final partial sub-block).
    const weight = j === subBlocks - 1 ? frames - j * SUB_BLOCK : SUB_BLOCK;
    lowSum += q * weight;
    lowSquares += q * q * weight;
  }
  s[4] = r1; s[5] = r2; s[6] = q1; s[7] = q2;
  flushDenormals(s);
  st.lowSum += lowSum;
  st.lowSquares += lowSquares;
}

export class StemMeter {
  private readonly config: StemMeterConfig;
  private readonly states: ChannelState[];
  private readonly weights: number[];
  private readonly filters: FilterSet;
  private quarterSums: Float64Array;
  private readonly peaks: Float32Array;
  private subMax = new Float32Array(0);
  private subMean = new Float64Array(0);
  private framesSeen = 0;

  constructor(config: StemMeterConfig) {
    this.config = config;
    this.states = Array.from({ length: config.channels }, () => new ChannelState(config.sampleRate));
    this.weights = channelWeights(config.channels, config.channelMask);
    const subRate = config.sampleRate / SUB_BLOCK;
    const rumble = butterworthLowPass(subRate, Math.min(RUMBLE_CUTOFF_HZ, subRate * 0.4), RUMBLE_ORDER);
    this.filters = { shelf: kWeightingShelf(config.sampleRate), highPass: kWeightingHighPass(config.sampleRate), rumble: [rumble[0], rumble[1]] };
    this.quarterSums = new Float64Array(Math.ceil((config.frames * 10) / config.sampleRate) + 2);
    this.peaks = new Float32Array(Math.ceil(config.frames / PEAK_BUCKET) + 1);
  }

  /** `buffers[c]` holds history then `frames` new samples; blocks must start on a PEAK_BUCKET boundary. */
  process(buffers: Float32Array[], frames: number): void {
    if (frames <= 0) return;
    const subBlocks = Math.ceil(frames / SUB_BLOCK);
    if (this.subMax.length < subBlocks) {
      this.subMax = new Float32Array(subBlocks);
      this.subMean = new Float64Array(subBlocks);
    }
    this.ensureQuarterRoom(frames);
    const firstBucket = Math.floor(this.framesSeen / PEAK_BUCKET);
    const { sampleRate, clipThreshold } = this.config;
    for (let c = 0; c < this.states.length; c++) {
      const st = this.states[c];
      const x = buffers[c];
      measureBlock(x, frames, st, {
        subMax: this.subMax,
        subMean: this.subMean,
        peaks: this.peaks,
        firstBucket,
        firstFrame: this.framesSeen,
        clip: clipThreshold,
        filters: this.filters,
        quarterSums: this.quarterSums,
        weight: this.weights[c],
        sampleRate,
      });
      rumblePass(this.subMean, subBlocks, frames, st, this.filters);
      st.truePeak.process(x, frames, this.subMax, st.peak);
    }
    this.framesSeen += frames;
  }

  /** Moves the last TRUE_PEAK_HISTORY samples of each buffer to its front for the next block. */
  static carryHistory(buffers: Float32Array[], frames: number): void {
    for (const x of buffers) x.copyWithin(0, frames, frames + TRUE_PEAK_HISTORY);
  }

  private ensureQuarterRoom(frames: number): void {
    const needed = Math.ceil(((this.framesSeen + frames) * 10) / this.config.sampleRate) + 2;
    if (needed <= this.quarterSums.length) return;
    const grown = new Float64Array(Math.max(needed, this.quarterSums.length * 2));
    grown.set(this.quarterSums);
    this.quarterSums = grown;
  }

  /**
   * Call after the last block (its history already carried to the front): feeds TRUE_PEAK_HISTORY
   * zeros so the interpolations around the final samples count too.
   */
  finish(buffers: Float32Array[]): StemMeasures {
    const zeroMax = new Float32Array(1);
    for (let c = 0; c < this.states.length; c++) {
      const x = buffers[c];
      x.fill(0, TRUE_PEAK_HISTORY, TRUE_PEAK_HISTORY * 2);
      const st = this.states[c];
      st.truePeak.process(x, TRUE_PEAK_HISTORY, zeroMax, st.peak);
    }
    return this.result();
  }

  private result(): StemMeasures {
    const { frames: expected, sampleRate } = this.config;
    const n = this.framesSeen || expected;
    let samplePeak = 0;
    let squares = 0;
    let dcOffset = 0;
    let clippedRuns = 0;
    let clippedSamples = 0;
    let acEnergy = 0;
    let lowEnergy = 0;
    let truePeak: number | null = 0;
    let skipped = 0;
    let evaluated = 0;
    for (const st of this.states) {
      samplePeak = Math.max(samplePeak, st.peak);
      squares += st.sumSquares;
      const dc = n > 0 ? st.sum / n : 0;
      if (Math.abs(dc) > Math.abs(dcOffset)) dcOffset = dc;
      clippedRuns += st.clippedRuns + (st.clipRun >= CLIP_RUN ? 1 : 0);
      clippedSamples += st.clippedSamples + (st.clipRun >= CLIP_RUN ? st.clipRun : 0);
      acEnergy += Math.max(0, st.sumSquares - (st.sum * st.sum) / Math.max(1, n));
      lowEnergy += Math.max(0, st.lowSquares - (st.lowSum * st.lowSum) / Math.max(1, n));
      truePeak = Math.max(truePeak, st.truePeak.result(st.peak));
      skipped += st.truePeak.skipped;
      evaluated += st.truePeak.evaluated;
    }
    const quarters = Math.max(0, this.countCompleteQuarters(n, sampleRate));
    return {
      samplePeak,
      truePeak: this.states[0]?.truePeak.oversampling === 1 ? samplePeak : truePeak,
      integratedLufs: integratedLoudness(this.quarterSums, quarters, sampleRate),
      meanSquare: n > 0 ? squares / (n * this.states.length) : 0,
      dcOffset,
      clippedRuns,
      clippedSamples,
      rumbleRatio: acEnergy > 1e-20 ? Math.min(1, lowEnergy / acEnergy) : null,
      peaks: this.peaks.subarray(0, Math.ceil(n / PEAK_BUCKET)),
      truePeakSkippedFraction: skipped + evaluated > 0 ? skipped / (skipped + evaluated) : 1,
    };
  }

  private countCompleteQuarters(frames: number, sampleRate: number): number {
    let q = Math.floor((frames * 10) / sampleRate);
    while (q > 0 && quarterStart(q, sampleRate) > frames) q--;
    return q;
  }
}
