import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { z } from 'zod';
import { briefListResponseSchema, type briefListQuerySchema } from '@shared/schemas/runs';
import { api } from '@/lib/api-client';

export type BriefListParams = Partial<z.output<typeof briefListQuerySchema>>;
export const BRIEFS_FIRST_PAGE: BriefListParams = { page: 1, pageSize: 25 };

export const briefsKeys = {
  all: ['briefs'] as const,
  lists: () => [...briefsKeys.all, 'list'] as const,
  list: (params: BriefListParams) => [...briefsKeys.lists(), params] as const,
  detail: (id: number) => [...briefsKeys.all, 'detail', id] as const,
  runs: (id: number) => [...briefsKeys.detail(id), 'runs'] as const,
};

/** One page of the workspace's briefs, most recently changed first unless sorted otherwise, each with its last run. */
export async function getBriefs(params: BriefListParams, signal?: AbortSignal) {
  return api.get('/api/briefs', { query: params, schema: briefListResponseSchema, signal });
}

export const getBriefsQueryOptions = (params: BriefListParams = BRIEFS_FIRST_PAGE) =>
  queryOptions({
    queryKey: briefsKeys.list(params),
    queryFn: ({ signal }) => getBriefs(params, signal),
    placeholderData: keepPreviousData,
  });

export function useBriefs(params: BriefListParams = BRIEFS_FIRST_PAGE) {
  return useQuery(getBriefsQueryOptions(params));
}
