import { queryOptions, useQueries, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { candidateRecordSchema, candidateResponseSchema } from '@shared/schemas/runs';
import { api } from '@/lib/api-client';

export const candidatesKeys = {
  all: ['candidates'] as const,
  detail: (id: number) => [...candidatesKeys.all, 'detail', id] as const,
  compare: (ids: readonly number[]) => [...candidatesKeys.all, 'compare', ids] as const,
};

/** One candidate with the brief it answers (as the run froze it) and the workspace currency. */
export async function getCandidate(id: number, signal?: AbortSignal) {
  return api.get(`/api/candidates/${id}`, { schema: candidateResponseSchema, signal });
}

export const getCandidateQueryOptions = (id: number) =>
  queryOptions({ queryKey: candidatesKeys.detail(id), queryFn: ({ signal }) => getCandidate(id, signal) });

export function useCandidate(id: number) {
  return useQuery(getCandidateQueryOptions(id));
}

/** Each candidate's detail at once (the briefs behind them, for their curves). */
export function useCandidateDetails(ids: readonly number[]) {
  return useQueries({ queries: ids.map((id) => getCandidateQueryOptions(id)) });
}

const compareResponseSchema = z.object({ candidates: z.array(candidateRecordSchema) });

/** 2–4 candidates side by side, in the order asked. */
export async function compareCandidates(ids: readonly number[], signal?: AbortSignal) {
  const { candidates } = await api.get('/api/candidates/compare', { query: { ids: ids.join(',') }, schema: compareResponseSchema, signal });
  return candidates;
}

export const compareCandidatesQueryOptions = (ids: readonly number[]) =>
  queryOptions({
    queryKey: candidatesKeys.compare(ids),
    queryFn: ({ signal }) => compareCandidates(ids, signal),
    enabled: ids.length >= 2 && ids.length <= 4,
  });

export function useCompareCandidates(ids: readonly number[]) {
  return useQuery(compareCandidatesQueryOptions(ids));
}
