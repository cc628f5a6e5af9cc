import { useEffect, useRef, useState } from 'react';
import { Alert, Button, Spinner } from '@/components/ui';
import { guideAudioUrl, useGuidePeaks } from '../api/get-guide-peaks';

/**
 * Plays the guide track with a waveform drawn from the peaks the server computed, so the browser never
 * decodes the file; the audio streams with range requests. wavesurfer.js loads only when a player shows.
 */
export function GuidePlayer({ briefId, name, hasPeaks }: { briefId: string; name: string; hasPeaks: boolean }) {
  const peaks = useGuidePeaks(briefId, hasPeaks);
  const container = useRef<HTMLDivElement>(null);
  const player = useRef<{ playPause(): Promise<void> | void; destroy(): void } | null>(null);
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
        const level = data.levels[0];
        const ws = WaveSurfer.create({
          container: el,
          url: guideAudioUrl(briefId),
          peaks: [level.data],
          duration: data.durationSec,
          height: 72,
          waveColor: '#94a3b8',
          progressColor: '#0f766e',
          cursorColor: '#134e4a',
          barWidth: 2,
          barGap: 1,
          normalize: true,
        });
        ws.on('ready', () => setReady(true));
        ws.on('play', () => setPlaying(true));
        ws.on('pause', () => setPlaying(false));
        ws.on('finish', () => setPlaying(false));
        ws.on('error', (e) => setFailed(e instanceof Error ? e.message : 'The guide track could not be played'));
        player.current = ws;
        // With peaks and a duration given, the waveform is drawn at once; playing waits for the stream.
        setReady(true);
      })
      .catch(() => setFailed('The player could not be loaded'));
    return () => {
      cancelled = true;
      player.current?.destroy();
      player.current = null;
    };
  }, [peaks.data, briefId]);

  if (!hasPeaks) {
    return <audio controls preload="none" src={guideAudioUrl(briefId)} aria-label={`Guide track: ${name}`} className="w-full" />;
  }
  return (
    <div className="space-y-3">
      {peaks.isPending ? <Spinner label="Loading the waveform" /> : null}
      {peaks.error || failed ? <Alert tone="error">{failed ?? 'The waveform could not be loaded.'}</Alert> : null}
      <div ref={container} role="img" aria-label={`Waveform of the guide track ${name}`} className="rounded-lg bg-canvas-sunken px-2" />
      <div className="flex items-center gap-3">
        <Button variant="secondary" size="sm" disabled={!ready} onClick={() => void player.current?.playPause()} aria-pressed={playing}>
          {playing ? 'Pause' : 'Play'} guide track
        </Button>
        <span className="text-sm text-ink-muted">{name}</span>
      </div>
    </div>
  );
}
