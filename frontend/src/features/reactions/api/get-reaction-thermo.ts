import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { reactionResponseSchema, type ReactionRequest } from '@shared/schemas/thermo';
import { api } from '@/lib/api-client';

export const reactionKeys = {
  all: ['thermo', 'reaction'] as const,
  detail: (request: ReactionRequest) => [...reactionKeys.all, request] as const,
};

/** ΔrH, ΔrS, ΔrG and the crossover temperature of a balanced reaction, from the workspace's species data. */
export async function getReactionThermo(request: ReactionRequest, signal?: AbortSignal) {
  return api.post('/api/thermo/reaction', { body: request, schema: reactionResponseSchema, signal });
}

export const getReactionThermoQueryOptions = (request: ReactionRequest | null) =>
  queryOptions({
    queryKey: request ? reactionKeys.detail(request) : [...reactionKeys.all, 'none'],
    queryFn: ({ signal }) => getReactionThermo(request!, signal),
    enabled: request !== null,
    placeholderData: keepPreviousData,
    staleTime: 60_000,
  });

export function useReactionThermo(request: ReactionRequest | null) {
  return useQuery(getReactionThermoQueryOptions(request));
}
