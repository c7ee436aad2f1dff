import { queryOptions, useQuery } from '@tanstack/react-query';
import { ingredientListResponseSchema } from '@shared/schemas/library';
import { api } from '@/lib/api-client';

const PARAMS = { page: 1, pageSize: 200, sort: 'name' } as const;

/**
 * The library ingredients a brief can allow or exclude (the first 200 by name). The key sits under
 * ['ingredients', 'list'], so a change to the library refreshes these choices too.
 */
export const briefIngredientsQueryOptions = () =>
  queryOptions({
    queryKey: ['ingredients', 'list', PARAMS] as const,
    queryFn: ({ signal }) => api.get('/api/ingredients', { query: PARAMS, schema: ingredientListResponseSchema, signal }),
    staleTime: 60_000,
  });

export function useBriefIngredients() {
  return useQuery(briefIngredientsQueryOptions());
}
