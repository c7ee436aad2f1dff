import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { runSummarySchema, type RunSummary } from '@shared/schemas/runs';
import { api } from '@/lib/api-client';
import { runsKeys } from './get-run';

const cancelResponseSchema = z.object({ run: runSummarySchema });

/** Stops a queued or running run; a finished one answers 409. */
export async function cancelRun(id: number): Promise<RunSummary> {
  const { run } = await api.post(`/api/runs/${id}/cancel`, { schema: cancelResponseSchema });
  return run;
}

export function useCancelRun() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: cancelRun,
    onSettled: (_run, _error, id) => {
      void queryClient.invalidateQueries({ queryKey: runsKeys.detail(id) });
      // The brief's run list and last-run badge follow.
      void queryClient.invalidateQueries({ queryKey: ['briefs'] });
    },
  });
}
