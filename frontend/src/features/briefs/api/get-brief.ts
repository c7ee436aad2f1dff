import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { briefRecordSchema, type BriefRecord } from '@shared/schemas/runs';
import { api } from '@/lib/api-client';
import { briefsKeys } from './get-briefs';

export const briefResponseSchema = z.object({ brief: briefRecordSchema });

/** One brief with its spec (every default applied), version and last run. */
export async function getBrief(id: number, signal?: AbortSignal): Promise<BriefRecord> {
  const { brief } = await api.get(`/api/briefs/${id}`, { schema: briefResponseSchema, signal });
  return brief;
}

export const getBriefQueryOptions = (id: number) =>
  queryOptions({
    queryKey: briefsKeys.detail(id),
    queryFn: ({ signal }) => getBrief(id, signal),
    enabled: id > 0,
  });

export function useBrief(id: number) {
  return useQuery(getBriefQueryOptions(id));
}
