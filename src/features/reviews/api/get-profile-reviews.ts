import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ProfileReviews, ReviewSubjectRole } from '@shared/schemas/reviews';
import { api } from '@/lib/api-client';
import { reviewKeys } from './keys';

export function getProfileReviews(role: ReviewSubjectRole, personId: string, signal?: AbortSignal): Promise<ProfileReviews> {
  const base = role === 'drummer' ? '/api/drummers' : '/api/engineers';
  return api.get<ProfileReviews>(`${base}/${encodeURIComponent(personId)}/reviews`, { signal });
}

export function profileReviewsQueryOptions(role: ReviewSubjectRole, personId: string) {
  return queryOptions({ queryKey: reviewKeys.forProfile(role, personId), queryFn: ({ signal }) => getProfileReviews(role, personId, signal) });
}

export function useProfileReviews(role: ReviewSubjectRole, personId: string) {
  return useQuery(profileReviewsQueryOptions(role, personId));
}
