import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { candidateRecordSchema, type CandidateRecord } from '@shared/schemas/runs';
import { api } from '@/lib/api-client';
import { candidatesKeys } from './get-candidate';

const shortlistResponseSchema = z.object({ candidate: candidateRecordSchema });

/** Puts a candidate on the shortlist (or takes it off). Designers and administrators only. */
export async function shortlistCandidate({ id, shortlisted }: { id: number; shortlisted: boolean }): Promise<CandidateRecord> {
  const { candidate } = await api.post(`/api/candidates/${id}/shortlist`, { body: { shortlisted }, schema: shortlistResponseSchema });
  return candidate;
}

export function useShortlistCandidate() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: shortlistCandidate,
    onSuccess: (candidate) => {
      void queryClient.invalidateQueries({ queryKey: candidatesKeys.all });
      // The run that proposed it shows its state too.
      void queryClient.invalidateQueries({ queryKey: ['runs', 'detail', candidate.runId] });
    },
  });
}
