import { queryOptions, useQuery } from '@tanstack/react-query';
import type { WaveformPeaks } from '@shared/schemas/delivery-check';
import { reelPeaksPath } from '@shared/schemas/reels';
import { api } from '@/lib/api-client';
import { reelKeys } from './keys';

export function getReelPeaks(trackId: string, signal?: AbortSignal): Promise<WaveformPeaks> {
  return api.get(reelPeaksPath(trackId), { signal });
}

export function reelPeaksQueryOptions(trackId: string) {
  // A track's peaks never change: a new upload is a new track.
  return queryOptions({ queryKey: reelKeys.peaks(trackId), queryFn: ({ signal }) => getReelPeaks(trackId, signal), staleTime: Infinity });
}

export function useReelPeaks(trackId: string, enabled: boolean) {
  return useQuery({ ...reelPeaksQueryOptions(trackId), enabled });
}
