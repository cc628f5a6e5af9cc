import { useEffect, useRef, useState } from 'react';
import type { ReelTrackSummary } from '@shared/schemas/profiles';
import { reelAudioPath } from '@shared/schemas/reels';
import { Alert, Button, Spinner } from '@/components/ui';
import { useReelPeaks } from '../api/get-reel-peaks';

type Player = { playPause(): Promise<void> | void; destroy(): void };

/**
 * One reel track: the waveform comes from the peaks the server computed at upload, the audio streams from
 * the range URL through a media element, so the browser never decodes the file. wavesurfer.js is imported
 * only when a player mounts, keeping it out of the home page's bundle. Tracks without peaks (stored before MP3
 * peaks were computed) get the browser’s own audio controls.
 */
export function ReelPlayer({ track }: { track: ReelTrackSummary }) {
  const peaks = useReelPeaks(track.id, track.hasPeaks);
  const container = useRef<HTMLDivElement>(null);
  const player = useRef<Player | null>(null);
  const [playing, setPlaying] = useState(false);
  const [ready, setReady] = useState(false);
  const [failed, setFailed] = useState<string | null>(null);

  useEffect(() => {
    if (!peaks.data || !container.current) return;
    let cancelled = false;
    const el = container.current;
    const data = peaks.data;
    void import('wavesurfer.js')
      .then(({ default: WaveSurfer }) => {
        if (cancelled) return;
        const media = new Audio();
        media.preload = 'metadata';
        media.src = reelAudioPath(track.id);
        const ws = WaveSurfer.create({
          container: el,
          media,
          peaks: [data.levels[0].data],
          duration: data.durationSec,
          height: 64,
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
        ws.on('error', (e) => setFailed(e instanceof Error ? e.message : 'This track could not be played'));
        player.current = ws;
        setReady(true);
      })
      .catch(() => setFailed('The player could not be loaded'));
    return () => {
      cancelled = true;
      player.current?.destroy();
      player.current = null;
      setReady(false);
    };
  }, [peaks.data, track.id]);

  const caption = [track.style, track.tempoBpm ? `${track.tempoBpm} BPM` : null, track.durationSec ? `${Math.round(track.durationSec)} s` : null].filter(Boolean).join(' · ');

  if (!track.hasPeaks) {
    return (
      <figure className="space-y-2">
        <figcaption className="font-medium">
          {track.title} <span className="text-sm font-normal text-ink-muted">{caption}</span>
        </figcaption>
        <audio controls preload="none" src={reelAudioPath(track.id)} aria-label={`Reel track: ${track.title}`} className="w-full" />
      </figure>
    );
  }
  return (
    <figure className="space-y-2" data-testid="reel-player">
      <figcaption className="font-medium">
        {track.title} <span className="text-sm font-normal text-ink-muted">{caption}</span>
      </figcaption>
      {peaks.isPending ? <Spinner label="Loading the waveform" /> : null}
      {peaks.error || failed ? <Alert tone="error">{failed ?? 'The waveform could not be loaded.'}</Alert> : null}
      <div ref={container} role="img" aria-label={`Waveform of ${track.title}`} className="rounded-lg bg-canvas-sunken px-2" />
      <Button variant="secondary" size="sm" disabled={!ready} onClick={() => void player.current?.playPause()} aria-pressed={playing}>
        {playing ? 'Pause' : 'Play'} <span className="sr-only">{track.title}</span>
      </Button>
    </figure>
  );
}
