import { queryOptions, useQuery } from '@tanstack/react-query';
import { ingredientListResponseSchema } from '@shared/schemas/library';
import { api } from '@/lib/api-client';

const PARAMS = { page: 1, pageSize: 200, sort: 'name' } as const;

/**
 * The ingredients a bench component can be chosen from (the first 200 by name). The key sits under
 * ['ingredients', 'list'], so a change to the library refreshes the bench's choices too.
 */
export const benchIngredientsQueryOptions = () =>
  queryOptions({
    queryKey: ['ingredients', 'list', PARAMS] as const,
    queryFn: ({ signal }) => api.get('/api/ingredients', { query: PARAMS, schema: ingredientListResponseSchema, signal }),
    staleTime: 60_000,
  });

export function useBenchIngredients() {
  return useQuery(benchIngredientsQueryOptions());
}
