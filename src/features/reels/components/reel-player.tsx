import type { ReelTrackSummary } from '@shared/schemas/profiles';
import { reelAudioPath } from '@shared/schemas/reels';
import { Alert, Button, Spinner } from '@/components/ui';
import { usePeaksWaveform } from '@/lib/use-peaks-waveform';
import { useReelPeaks } from '../api/get-reel-peaks';

/**
 * One reel track, its waveform from the peaks computed at upload. Tracks without peaks (stored before MP3
 * peaks were computed) get the browser’s own audio controls.
 */
export function ReelPlayer({ track }: { track: ReelTrackSummary }) {
  const peaks = useReelPeaks(track.id, track.hasPeaks);
  const wave = usePeaksWaveform({ peaks: peaks.data, audioUrl: reelAudioPath(track.id), height: 64, playError: 'This track could not be played' });

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
      {peaks.error || wave.failed ? <Alert tone="error">{wave.failed ?? 'The waveform could not be loaded.'}</Alert> : null}
      <div ref={wave.container} role="img" aria-label={`Waveform of ${track.title}`} className="rounded-lg bg-canvas-sunken px-2" />
      <Button variant="secondary" size="sm" disabled={!wave.ready} onClick={wave.playPause} aria-pressed={wave.playing}>
        {wave.playing ? 'Pause' : 'Play'} <span className="sr-only">{track.title}</span>
      </Button>
    </figure>
  );
}
