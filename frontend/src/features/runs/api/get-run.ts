import { queryOptions, useQuery } from '@tanstack/react-query';
import { runDetailSchema, type RunDetail } from '@shared/schemas/runs';
import { api } from '@/lib/api-client';

export const runsKeys = {
  all: ['runs'] as const,
  detail: (id: number) => [...runsKeys.all, 'detail', id] as const,
};

/** How often a queued or running run is asked for its progress, ms. */
export const RUN_POLL_MS = 700;

/** A run: status and progress while it works; then ranked candidates, infeasible sets and the sweep. */
export async function getRun(id: number, signal?: AbortSignal): Promise<RunDetail> {
  return api.get(`/api/runs/${id}`, { schema: runDetailSchema, signal });
}

export const isFinished = (status: string | undefined) => status === 'succeeded' || status === 'failed' || status === 'cancelled';

export const getRunQueryOptions = (id: number) =>
  queryOptions({
    queryKey: runsKeys.detail(id),
    queryFn: ({ signal }) => getRun(id, signal),
    enabled: id > 0,
    // Poll until the run has finished; a finished run does not change.
    refetchInterval: (query) => (query.state.error || isFinished(query.state.data?.status) ? false : RUN_POLL_MS),
    refetchIntervalInBackground: false,
    staleTime: (query) => (isFinished(query.state.data?.status) ? 60_000 : 0),
  });

export function useRun(id: number) {
  return useQuery(getRunQueryOptions(id));
}
