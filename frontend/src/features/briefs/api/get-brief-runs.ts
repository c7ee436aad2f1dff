import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { Paged } from '@shared/schemas';
import { runListResponseSchema, type RunSummary } from '@shared/schemas/runs';
import { api } from '@/lib/api-client';
import { briefsKeys } from './get-briefs';

export interface RunPageParams {
  page: number;
  pageSize: number;
}
export const RUNS_FIRST_PAGE: RunPageParams = { page: 1, pageSize: 10 };

/** One page of the brief's runs, newest first. */
export async function getBriefRuns(briefId: number, params: RunPageParams, signal?: AbortSignal): Promise<Paged<RunSummary>> {
  return api.get(`/api/briefs/${briefId}/runs`, { query: { ...params }, schema: runListResponseSchema, signal });
}

const isActive = (runs: Paged<RunSummary> | undefined) => !!runs?.items.some((r) => r.status === 'queued' || r.status === 'running');

export const getBriefRunsQueryOptions = (briefId: number, params: RunPageParams = RUNS_FIRST_PAGE) =>
  queryOptions({
    queryKey: [...briefsKeys.runs(briefId), params] as const,
    queryFn: ({ signal }) => getBriefRuns(briefId, params, signal),
    enabled: briefId > 0,
    placeholderData: keepPreviousData,
    // While a run is queued or running, its row keeps up.
    refetchInterval: (query) => (isActive(query.state.data) ? 1500 : false),
  });

export function useBriefRuns(briefId: number, params: RunPageParams = RUNS_FIRST_PAGE) {
  return useQuery(getBriefRunsQueryOptions(briefId, params));
}
