import { useEffect, useRef, useState, type RefObject } from 'react';
import type { WaveformPeaks } from '@shared/schemas/delivery-check';

type Player = { playPause(): Promise<void> | void; destroy(): void };

export type PeaksWaveform = {
  container: RefObject<HTMLDivElement | null>;
  ready: boolean;
  playing: boolean;
  failed: string | null;
  playPause: () => void;
};

/**
 * A wavesurfer.js player drawn from peaks the server computed, over audio streamed through a media element
 * with range requests, so the browser never decodes the whole file. wavesurfer.js is imported only when a
 * player mounts, which keeps it out of the first page's bundle.
 */
export function usePeaksWaveform(opts: { peaks: WaveformPeaks | undefined; audioUrl: string; height: number; playError: string }): PeaksWaveform {
  const { peaks, audioUrl, height, playError } = opts;
  const container = useRef<HTMLDivElement>(null);
  const player = useRef<Player | null>(null);
  const [playing, setPlaying] = useState(false);
  const [ready, setReady] = useState(false);
  const [failed, setFailed] = useState<string | null>(null);

  useEffect(() => {
    if (!peaks || !container.current) return;
    let cancelled = false;
    const el = container.current;
    void import('wavesurfer.js')
      .then(({ default: WaveSurfer }) => {
        if (cancelled) return;
        const media = new Audio();
        media.preload = 'metadata';
        media.src = audioUrl;
        const ws = WaveSurfer.create({
          container: el,
          media,
          peaks: [peaks.levels[0].data],
          duration: peaks.durationSec,
          height,
          waveColor: '#94a3b8',
          progressColor: '#0f766e',
          cursorColor: '#134e4a',
          barWidth: 2,
          barGap: 1,
          normalize: true,
        });
        ws.on('play', () => setPlaying(true));
        ws.on('pause', () => setPlaying(false));
        ws.on('finish', () => setPlaying(false));
        ws.on('error', (e) => setFailed(e instanceof Error ? e.message : playError));
        player.current = ws;
        // With peaks and a duration given, the waveform is drawn at once; playing waits for the stream.
        setReady(true);
      })
      .catch(() => setFailed('The player could not be loaded'));
    return () => {
      cancelled = true;
      player.current?.destroy();
      player.current = null;
      setReady(false);
    };
  }, [peaks, audioUrl, height, playError]);

  return { container, ready, playing, failed, playPause: () => void player.current?.playPause() };
}
