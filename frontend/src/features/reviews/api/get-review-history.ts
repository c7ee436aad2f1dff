import { queryOptions, useQuery } from '@tanstack/react-query';
import { reviewHistoryResponseSchema } from '@shared/schemas/reviews';
import { api } from '@/lib/api-client';

export const reviewsKeys = {
  all: ['reviews'] as const,
  queue: () => [...reviewsKeys.all, 'queue'] as const,
  history: (candidateId: number) => [...reviewsKeys.all, 'history', candidateId] as const,
  hazards: (candidateId: number) => [...reviewsKeys.all, 'hazards', candidateId] as const,
  dossier: (candidateId: number) => [...reviewsKeys.all, 'dossier', candidateId] as const,
};

/** A candidate's review state, its decisions and the timeline of its versions. */
export async function getReviewHistory(candidateId: number, signal?: AbortSignal) {
  return api.get(`/api/candidates/${candidateId}/reviews`, { schema: reviewHistoryResponseSchema, signal });
}

export const getReviewHistoryQueryOptions = (candidateId: number) =>
  queryOptions({ queryKey: reviewsKeys.history(candidateId), queryFn: ({ signal }) => getReviewHistory(candidateId, signal) });

export function useReviewHistory(candidateId: number) {
  return useQuery(getReviewHistoryQueryOptions(candidateId));
}
