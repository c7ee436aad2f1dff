import { queryOptions, useQuery } from '@tanstack/react-query';
import { briefListResponseSchema, type BriefRecord } from '@shared/schemas/runs';
import { api } from '@/lib/api-client';

export const briefsKeys = {
  all: ['briefs'] as const,
  lists: () => [...briefsKeys.all, 'list'] as const,
  detail: (id: number) => [...briefsKeys.all, 'detail', id] as const,
  runs: (id: number) => [...briefsKeys.detail(id), 'runs'] as const,
};

/** Every brief of the workspace, most recently changed first, each with its last run. */
export async function getBriefs(signal?: AbortSignal): Promise<BriefRecord[]> {
  const { briefs } = await api.get('/api/briefs', { schema: briefListResponseSchema, signal });
  return briefs;
}

export const getBriefsQueryOptions = () =>
  queryOptions({
    queryKey: briefsKeys.lists(),
    queryFn: ({ signal }) => getBriefs(signal),
  });

export function useBriefs() {
  return useQuery(getBriefsQueryOptions());
}
