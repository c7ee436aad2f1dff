import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { speciesListResponseSchema, type SpeciesListQuery } from '@shared/schemas/library';
import { api } from '@/lib/api-client';

export type SpeciesListParams = Partial<SpeciesListQuery>;

export const speciesKeys = {
  all: ['species'] as const,
  list: (params: SpeciesListParams) => [...speciesKeys.all, 'list', params] as const,
};

/** One page of species data (reference rows and the workspace's own), searched and filtered by phase. */
export async function getSpecies(params: SpeciesListParams, signal?: AbortSignal) {
  return api.get('/api/species', { query: params, schema: speciesListResponseSchema, signal });
}

export const getSpeciesQueryOptions = (params: SpeciesListParams) =>
  queryOptions({
    queryKey: speciesKeys.list(params),
    queryFn: ({ signal }) => getSpecies(params, signal),
    placeholderData: keepPreviousData,
  });

export function useSpecies(params: SpeciesListParams) {
  return useQuery(getSpeciesQueryOptions(params));
}
