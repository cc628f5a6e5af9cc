// The room estimate as the API returns it, and the figures the rooms table keeps for search.
// Both come from the one pure module (shared/acoustics); nothing here computes acoustics itself.
import { computeAcoustics, READING_THRESHOLDS, type AcousticsResult } from '@shared/acoustics';
import { toRoomGeometry, type RoomAcousticsView, type RoomInput } from '@shared/schemas/rooms';

type Geometry = Pick<RoomInput, 'dimensions' | 'surfaces' | 'panels' | 'openings'>;

export function acousticsOf(room: Geometry): AcousticsResult {
  return computeAcoustics(toRoomGeometry(room));
}

/** `GET /api/rooms/:id/acoustics`: DESIGN.md's fixed keys first, then what the client needs to explain them. */
export function toAcousticsView(result: AcousticsResult): RoomAcousticsView {
  return {
    bands: result.bands.map((b) => ({ hz: b.hz, sabineSec: b.sabineSec, eyringSec: b.eyringSec, averageAbsorption: b.averageAbsorption })),
    modes: result.modes.map((m) => ({ hz: m.hz, axis: m.axis, order: m.order, coincidentWith: m.coincidentWith })),
    schroederHz: result.schroederHz,
    reading: result.reading,
    readingText: result.readingText,
    readingThresholds: [...READING_THRESHOLDS.map((t) => ({ reading: t.reading, belowSec: t.belowSec })), { reading: 'very_live' as const, belowSec: null }],
    recommended: result.recommended,
    recommendedReason: result.recommendedReason,
    midBandRt60Sec: result.midBandRt60Sec,
    volumeM3: result.volumeM3,
    surfaceM2: result.surfaceM2,
    speedOfSoundMs: result.speedOfSoundMs,
    notes: result.notes,
  };
}

/** The columns search filters on, recomputed whenever the geometry changes. */
export function searchColumnsOf(room: Geometry): { volumeM3: number; floorAreaM2: number; midRt60Sec: number; reading: AcousticsResult['reading'] } {
  const result = acousticsOf(room);
  const floor = result.surfaces.find((s) => s.surface === 'floor');
  return { volumeM3: result.volumeM3, floorAreaM2: floor?.grossM2 ?? 0, midRt60Sec: result.midBandRt60Sec, reading: result.reading };
}
