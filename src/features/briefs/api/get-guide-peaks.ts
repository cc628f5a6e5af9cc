import { queryOptions, useQuery } from '@tanstack/react-query';
import type { WaveformPeaks } from '@shared/schemas/delivery-check';
import { api } from '@/lib/api-client';
import { briefKeys } from './keys';

export function guideAudioUrl(briefId: string): string {
  return `/api/briefs/${encodeURIComponent(briefId)}/guide`;
}

export function getGuidePeaks(briefId: string, signal?: AbortSignal): Promise<WaveformPeaks> {
  return api.get(`${guideAudioUrl(briefId)}/peaks`, { signal });
}

export function guidePeaksQueryOptions(briefId: string) {
  // Peaks of a stored guide never change (a new guide gets new keys and a new brief version).
  return queryOptions({ queryKey: briefKeys.peaks(briefId), queryFn: ({ signal }) => getGuidePeaks(briefId, signal), staleTime: Infinity });
}

export function useGuidePeaks(briefId: string, enabled: boolean) {
  return useQuery({ ...guidePeaksQueryOptions(briefId), enabled });
}
