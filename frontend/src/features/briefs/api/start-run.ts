import { useMutation, useQueryClient } from '@tanstack/react-query';
import { createRunResponseSchema } from '@shared/schemas/runs';
import { api } from '@/lib/api-client';
import { briefsKeys } from './get-briefs';

/** Queues an optimiser run of the brief as it is now; answers the run's id (202). */
export async function startRun(briefId: number): Promise<number> {
  const { runId } = await api.post(`/api/briefs/${briefId}/runs`, { schema: createRunResponseSchema });
  return runId;
}

export function useStartRun() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: startRun,
    onSuccess: (_runId, briefId) => {
      void queryClient.invalidateQueries({ queryKey: briefsKeys.detail(briefId) });
      void queryClient.invalidateQueries({ queryKey: briefsKeys.lists() });
    },
  });
}
