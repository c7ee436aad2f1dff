import { queryOptions, useQuery } from '@tanstack/react-query';
import { candidateHazardsResponseSchema } from '@shared/schemas/reviews';
import { api } from '@/lib/api-client';
import { reviewsKeys } from './get-review-history';

/** The computed hazards of a candidate: notes with severity, GHS classification and label, the standing caution. */
export async function getCandidateHazards(candidateId: number, signal?: AbortSignal) {
  return api.get(`/api/candidates/${candidateId}/hazards`, { schema: candidateHazardsResponseSchema, signal });
}

export const getCandidateHazardsQueryOptions = (candidateId: number) =>
  queryOptions({ queryKey: reviewsKeys.hazards(candidateId), queryFn: ({ signal }) => getCandidateHazards(candidateId, signal) });

export function useCandidateHazards(candidateId: number) {
  return useQuery(getCandidateHazardsQueryOptions(candidateId));
}
