import { queryOptions, useQuery } from '@tanstack/react-query';
import { briefListResponseSchema, type BriefRecord } from '@shared/schemas/runs';
import { api } from '@/lib/api-client';

export const briefsKeys = {
  all: ['briefs'] as const,
  lists: () => [...briefsKeys.all, 'list'] as const,
  list: (archived: boolean) => [...briefsKeys.lists(), { archived }] as const,
  detail: (id: number) => [...briefsKeys.all, 'detail', id] as const,
  runs: (id: number) => [...briefsKeys.detail(id), 'runs'] as const,
};

/** The workspace's active briefs (or, with `archived`, the archived ones), most recently changed first, each with its last run. */
export async function getBriefs(archived: boolean, signal?: AbortSignal): Promise<BriefRecord[]> {
  const { briefs } = await api.get('/api/briefs', { query: archived ? { archived: 'true' } : undefined, schema: briefListResponseSchema, signal });
  return briefs;
}

export const getBriefsQueryOptions = (archived = false) =>
  queryOptions({
    queryKey: briefsKeys.list(archived),
    queryFn: ({ signal }) => getBriefs(archived, signal),
  });

export function useBriefs(archived = false) {
  return useQuery(getBriefsQueryOptions(archived));
}
