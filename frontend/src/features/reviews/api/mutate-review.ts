import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { reviewRecordSchema, transitionResponseSchema, type ReviseRequest } from '@shared/schemas/reviews';
import { api } from '@/lib/api-client';
import { reviewsKeys } from './get-review-history';

function invalidate(queryClient: QueryClient, candidateId: number, runId?: number) {
  void queryClient.invalidateQueries({ queryKey: reviewsKeys.all });
  void queryClient.invalidateQueries({ queryKey: ['candidates', 'detail', candidateId] });
  void queryClient.invalidateQueries({ queryKey: ['home'] });
  if (runId) void queryClient.invalidateQueries({ queryKey: ['runs', 'detail', runId] });
}

/** Designer: submit a shortlisted candidate for chemistry review (its composition is frozen from then on). */
export function useSubmitCandidate(candidateId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: { comment?: string }) => api.post(`/api/candidates/${candidateId}/submit`, { body, schema: transitionResponseSchema }),
    onSuccess: (res) => invalidate(queryClient, candidateId, res.candidate.runId),
  });
}

const decisionResponseSchema = transitionResponseSchema.extend({ review: reviewRecordSchema });

export type DecisionBody = { stage: 'chemistry' | 'regulatory'; verdict: 'approved' | 'changes-requested' | 'rejected'; checklist: Record<string, unknown>; comment: string };

/** Chemist or reviewer: a decision in their stage. */
export function useDecideReview(candidateId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: DecisionBody) => api.post(`/api/candidates/${candidateId}/reviews`, { body, schema: decisionResponseSchema }),
    onSuccess: (res) => invalidate(queryClient, candidateId, res.candidate.runId),
  });
}

/** Designer, after changes were requested: a new version with an edited composition. */
export function useReviseCandidate(candidateId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: ReviseRequest) => api.post(`/api/candidates/${candidateId}/revise`, { body, schema: transitionResponseSchema }),
    onSuccess: (res) => invalidate(queryClient, candidateId, res.candidate.runId),
  });
}

