import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateBriefRequest, UpdateBriefRequest } from '@shared/schemas/briefs';
import type { BriefRecord } from '@shared/schemas/runs';
import { api } from '@/lib/api-client';
import { briefResponseSchema } from './get-brief';
import { briefsKeys } from './get-briefs';

export async function createBrief(body: CreateBriefRequest): Promise<BriefRecord> {
  const { brief } = await api.post('/api/briefs', { body, schema: briefResponseSchema });
  return brief;
}

/** Saves a change; `version` is the one the designer loaded (a stale one answers 409). */
export async function updateBrief({ id, ...body }: UpdateBriefRequest & { id: number }): Promise<BriefRecord> {
  const { brief } = await api.patch(`/api/briefs/${id}`, { body, schema: briefResponseSchema });
  return brief;
}

export async function duplicateBrief(id: number): Promise<BriefRecord> {
  const { brief } = await api.post(`/api/briefs/${id}/duplicate`, { schema: briefResponseSchema });
  return brief;
}

/** Archives a brief: out of the default list, read-only, still reachable with everything it holds. */
export async function archiveBrief(id: number): Promise<BriefRecord> {
  const { brief } = await api.post(`/api/briefs/${id}/archive`, { schema: briefResponseSchema });
  return brief;
}

export async function unarchiveBrief(id: number): Promise<BriefRecord> {
  const { brief } = await api.post(`/api/briefs/${id}/unarchive`, { schema: briefResponseSchema });
  return brief;
}

/** 409 `brief_has_reviews` when candidates are in review or decided: archive instead. */
export async function deleteBrief(id: number): Promise<void> {
  await api.delete(`/api/briefs/${id}`);
}

function useBriefMutation<A>(fn: (arg: A) => Promise<BriefRecord>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: (saved) => {
      queryClient.setQueryData(briefsKeys.detail(saved.id), saved);
      void queryClient.invalidateQueries({ queryKey: briefsKeys.lists() });
    },
  });
}

export const useCreateBrief = () => useBriefMutation(createBrief);
export const useUpdateBrief = () => useBriefMutation(updateBrief);
export const useDuplicateBrief = () => useBriefMutation(duplicateBrief);
export const useArchiveBrief = () => useBriefMutation(archiveBrief);
export const useUnarchiveBrief = () => useBriefMutation(unarchiveBrief);

export function useDeleteBrief() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteBrief,
    onSuccess: (_void, id) => {
      queryClient.removeQueries({ queryKey: briefsKeys.detail(id) });
      void queryClient.invalidateQueries({ queryKey: briefsKeys.lists() });
    },
  });
}
