import { useMutation } from '@tanstack/react-query';
import type { EvaluateMixtureRequest } from '@shared/schemas/mixtures';
import { evaluateMixtureApiResponseSchema, type EvaluateMixtureApiResponse } from '@shared/schemas/thermo';
import { api } from '@/lib/api-client';

/** POST /api/mixtures/evaluate: the same evaluation on the server, with cost and hazard notes. */
export async function evaluateMixtureOnServer(body: EvaluateMixtureRequest): Promise<EvaluateMixtureApiResponse> {
  return api.post('/api/mixtures/evaluate', { body, schema: evaluateMixtureApiResponseSchema });
}

export function useEvaluateMixtureOnServer() {
  return useMutation({ mutationFn: evaluateMixtureOnServer });
}
