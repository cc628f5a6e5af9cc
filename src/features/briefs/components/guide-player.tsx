import { Alert, Button, Spinner } from '@/components/ui';
import { usePeaksWaveform } from '@/lib/use-peaks-waveform';
import { guideAudioUrl, useGuidePeaks } from '../api/get-guide-peaks';

/** Plays the guide track with a waveform drawn from the peaks the server computed. */
export function GuidePlayer({ briefId, name, hasPeaks }: { briefId: string; name: string; hasPeaks: boolean }) {
  const peaks = useGuidePeaks(briefId, hasPeaks);
  const wave = usePeaksWaveform({ peaks: peaks.data, audioUrl: guideAudioUrl(briefId), height: 72, playError: 'The guide track could not be played' });

  if (!hasPeaks) {
    return <audio controls preload="none" src={guideAudioUrl(briefId)} aria-label={`Guide track: ${name}`} className="w-full" />;
  }
  return (
    <div className="space-y-3">
      {peaks.isPending ? <Spinner label="Loading the waveform" /> : null}
      {peaks.error || wave.failed ? <Alert tone="error">{wave.failed ?? 'The waveform could not be loaded.'}</Alert> : null}
      <div ref={wave.container} role="img" aria-label={`Waveform of the guide track ${name}`} className="rounded-lg bg-canvas-sunken px-2" />
      <div className="flex items-center gap-3">
        <Button variant="secondary" size="sm" disabled={!wave.ready} onClick={wave.playPause} aria-pressed={wave.playing}>
          {wave.playing ? 'Pause' : 'Play'} guide track
        </Button>
        <span className="text-sm text-ink-muted">{name}</span>
      </div>
    </div>
  );
}
