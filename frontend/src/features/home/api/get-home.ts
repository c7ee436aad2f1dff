import { queryOptions, useQuery } from '@tanstack/react-query';
import { homeResponseSchema, type HomeResponse } from '@shared/schemas/health';
import { api } from '@/lib/api-client';

export const homeKeys = {
  all: ['home'] as const,
  summary: () => [...homeKeys.all, 'summary'] as const,
};

/** What is waiting for the signed-in member, and a few counts for their role. */
export function getHome(signal?: AbortSignal): Promise<HomeResponse> {
  return api.get('/api/home', { schema: homeResponseSchema, signal });
}

export const getHomeQueryOptions = () =>
  queryOptions({
    queryKey: homeKeys.summary(),
    queryFn: ({ signal }) => getHome(signal),
  });

export function useHome() {
  return useQuery(getHomeQueryOptions());
}
