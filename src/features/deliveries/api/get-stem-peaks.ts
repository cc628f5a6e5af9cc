import { queryOptions, useQuery } from '@tanstack/react-query';
import { deliveryPaths, type WaveformPeaks } from '@shared/schemas/deliveries';
import { api } from '@/lib/api-client';
import { deliveryKeys } from './keys';

export function getStemPeaks(id: string, fileId: string, signal?: AbortSignal): Promise<WaveformPeaks> {
  return api.get<WaveformPeaks>(deliveryPaths.peaks(id, fileId), { signal });
}

export function stemPeaksQueryOptions(id: string, fileId: string, enabled: boolean) {
  // Peaks of an uploaded file never change.
  return queryOptions({ queryKey: deliveryKeys.peaks(id, fileId), queryFn: ({ signal }) => getStemPeaks(id, fileId, signal), enabled, staleTime: Infinity });
}

export function useStemPeaks(id: string, fileId: string, enabled: boolean) {
  return useQuery(stemPeaksQueryOptions(id, fileId, enabled));
}
