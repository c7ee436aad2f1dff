import { queryOptions, useQuery } from '@tanstack/react-query';
import { candidateConfidenceResponseSchema } from '@shared/schemas/lab-logs';
import { api } from './api-client';

/** GET /api/candidates/:id/confidence — Monte Carlo band and the probability of meeting the brief. */
export async function getCandidateConfidence(id: number, signal?: AbortSignal) {
  const body = await api.get(`/api/candidates/${id}/confidence`, { schema: candidateConfidenceResponseSchema, signal });
  return body.confidence;
}

export const getCandidateConfidenceQueryOptions = (id: number) =>
  queryOptions({
    queryKey: ['candidates', 'confidence', id] as const,
    queryFn: ({ signal }) => getCandidateConfidence(id, signal),
    // Computed once per candidate on the server and kept; it does not change.
    staleTime: Infinity,
  });

export function useCandidateConfidence(id: number | null) {
  return useQuery({ ...getCandidateConfidenceQueryOptions(id ?? 0), enabled: id !== null && id > 0 });
}
