import { useEffect, useRef } from 'react';
import type { WaveformPeaks } from '@shared/schemas/deliveries';

/**
 * One stem's waveform, drawn by wavesurfer.js from the peaks the check wrote (the browser never decodes a
 * WAV to draw it). It only draws: the review room plays the audio and draws one playhead over all rows.
 */
export function StemWave({ peaks, width, height, label }: { peaks: WaveformPeaks | undefined; width: number; height: number; label: string }) {
  const container = useRef<HTMLDivElement>(null);
  // Fine peaks (256 samples a pixel) only when zoomed in far enough to show them.
  const level = peaks ? (width > peaks.levels[1].data.length * 2 ? peaks.levels[0] : peaks.levels[1]) : null;

  useEffect(() => {
    const el = container.current;
    if (!el || !peaks || !level) return;
    let destroyed = false;
    let ws: { destroy(): void } | null = null;
    void import('wavesurfer.js').then(({ default: WaveSurfer }) => {
      if (destroyed) return;
      ws = WaveSurfer.create({
        container: el,
        peaks: [level.data],
        duration: peaks.durationSec,
        height,
        waveColor: '#64748b',
        progressColor: '#64748b',
        cursorWidth: 0,
        interact: false,
        normalize: false,
        fillParent: true,
        barWidth: 1,
        barGap: 0,
      });
    });
    return () => {
      destroyed = true;
      ws?.destroy();
    };
  }, [peaks, level, height]);

  return <div ref={container} role="img" aria-label={`Waveform of ${label}`} style={{ width, height }} />;
}
