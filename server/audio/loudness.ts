// Integrated loudness per ITU-R BS.1770 with the EBU R128 gates: K-weighted mean squares over
// 400 ms blocks with 75 % overlap (so a block is four 100 ms quarters), incomplete trailing blocks
// dropped, absolute gate −70 LKFS, relative gate 10 LU below the loudness of the blocks above it.

export const ABSOLUTE_GATE_LUFS = -70;
export const RELATIVE_GATE_LU = -10;

/** First frame of 100 ms quarter `q`; exact for every rate, also where fs/10 is not an integer. */
export function quarterStart(q: number, sampleRate: number): number {
  return Math.floor((q * sampleRate) / 10);
}

export function loudnessOf(meanSquare: number): number {
  return -0.691 + 10 * Math.log10(meanSquare);
}

/**
 * Channel weights Gᵢ (BS.1770): 1.0 for front channels, 1.41 for surrounds, LFE excluded. Mono and
 * stereo are front channels. With a channel mask, its speaker bits decide; without one, six channels
 * are read in the common L R C LFE Ls Rs order.
 */
export function channelWeights(channels: number, channelMask: number | null): number[] {
  const weights = new Array<number>(channels).fill(1);
  if (channelMask && channelMask > 0) {
    const SURROUND_BITS = 0x10 | 0x20 | 0x200 | 0x400; // back L/R, side L/R
    const LFE_BIT = 0x8;
    let channel = 0;
    for (let bit = 0; bit < 32 && channel < channels; bit++) {
      const flag = 1 << bit;
      if ((channelMask & flag) === 0) continue;
      if (flag === LFE_BIT) weights[channel] = 0;
      else if (SURROUND_BITS & flag) weights[channel] = 1.41;
      channel++;
    }
    return weights;
  }
  if (channels === 6) return [1, 1, 1, 0, 1.41, 1.41];
  if (channels === 5) return [1, 1, 1, 1.41, 1.41];
  return weights;
}

/**
 * Gated integrated loudness from per-quarter sums of Σ Gᵢ·yᵢ² (y = K-weighted). Returns null when no
 * block passes the gates (silence, or shorter than one 400 ms block).
 */
export function integratedLoudness(quarterSums: Float64Array, quarters: number, sampleRate: number): number | null {
  const blocks = quarters - 3;
  if (blocks <= 0) return null;
  const meanSquares = new Float64Array(blocks);
  for (let j = 0; j < blocks; j++) {
    const sum = quarterSums[j] + quarterSums[j + 1] + quarterSums[j + 2] + quarterSums[j + 3];
    const length = quarterStart(j + 4, sampleRate) - quarterStart(j, sampleRate);
    meanSquares[j] = sum / length;
  }
  const absoluteFloor = Math.pow(10, (ABSOLUTE_GATE_LUFS + 0.691) / 10);
  let aboveAbsolute = 0;
  let count = 0;
  for (let j = 0; j < blocks; j++) {
    if (meanSquares[j] > absoluteFloor) {
      aboveAbsolute += meanSquares[j];
      count++;
    }
  }
  if (count === 0) return null;
  const relativeGate = loudnessOf(aboveAbsolute / count) + RELATIVE_GATE_LU;
  const relativeFloor = Math.max(absoluteFloor, Math.pow(10, (relativeGate + 0.691) / 10));
  let gated = 0;
  let gatedCount = 0;
  for (let j = 0; j < blocks; j++) {
    if (meanSquares[j] > relativeFloor) {
      gated += meanSquares[j];
      gatedCount++;
    }
  }
  return gatedCount === 0 ? null : loudnessOf(gated / gatedCount);
}
