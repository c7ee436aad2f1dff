import { queryOptions, useQuery } from '@tanstack/react-query';
import { runListResponseSchema, type RunSummary } from '@shared/schemas/runs';
import { api } from '@/lib/api-client';
import { briefsKeys } from './get-briefs';

/** The brief's runs, newest first (at most 50). */
export async function getBriefRuns(briefId: number, signal?: AbortSignal): Promise<RunSummary[]> {
  const { runs } = await api.get(`/api/briefs/${briefId}/runs`, { schema: runListResponseSchema, signal });
  return runs;
}

const isActive = (runs: RunSummary[] | undefined) => !!runs?.some((r) => r.status === 'queued' || r.status === 'running');

export const getBriefRunsQueryOptions = (briefId: number) =>
  queryOptions({
    queryKey: briefsKeys.runs(briefId),
    queryFn: ({ signal }) => getBriefRuns(briefId, signal),
    enabled: briefId > 0,
    // While a run is queued or running, its row keeps up.
    refetchInterval: (query) => (isActive(query.state.data) ? 1500 : false),
  });

export function useBriefRuns(briefId: number) {
  return useQuery(getBriefRunsQueryOptions(briefId));
}
