import { READING_LABELS } from '@shared/acoustics';
import type { RoomAcousticsView } from '@shared/schemas/rooms';
import { Badge } from '@/components/ui';

/** The plain-words reading for drums, the thresholds it uses (common practice), and which formula to trust. */
export function RoomReading({ acoustics }: { acoustics: RoomAcousticsView }) {
  const thresholds = acoustics.readingThresholds;
  return (
    <div className="space-y-3">
      <p className="flex flex-wrap items-center gap-2 text-lg">
        For drums this room reads <Badge tone="brand">{READING_LABELS[acoustics.reading]}</Badge>
        <span className="text-ink-muted">(mid-band RT60 {acoustics.midBandRt60Sec.toFixed(2)} s)</span>
      </p>
      <p>{acoustics.readingText}</p>
      <div className="text-sm">
        <p className="font-medium">Thresholds (common practice for tracking rooms, not a standard), mid-band 500 Hz–1 kHz:</p>
        <ul className="mt-1 list-disc pl-5">
          {thresholds.map((t, i) => {
            const from = i === 0 ? null : thresholds[i - 1].belowSec;
            const range = t.belowSec === null ? `${from} s or more` : from === null ? `below ${t.belowSec} s` : `${from} s to under ${t.belowSec} s`;
            return (
              <li key={t.reading}>
                {READING_LABELS[t.reading]}: {range}
              </li>
            );
          })}
        </ul>
      </div>
      <p className="text-sm">
        <span className="font-medium">Which formula to trust: {acoustics.recommended === 'eyring' ? 'Eyring' : 'Sabine'}.</span> {acoustics.recommendedReason}
      </p>
      {acoustics.notes.length > 0 ? (
        <ul className="list-disc pl-5 text-sm">
          {acoustics.notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      ) : null}
      <p className="text-sm text-ink-muted">
        An estimate for a rectangular room from handbook absorption values (Sabine and Eyring, REFERENCES.md); the real room may differ. Volume{' '}
        {acoustics.volumeM3.toFixed(0)} m³, surface {acoustics.surfaceM2.toFixed(0)} m², speed of sound {acoustics.speedOfSoundMs.toFixed(1)} m/s at 20 °C.
      </p>
    </div>
  );
}
