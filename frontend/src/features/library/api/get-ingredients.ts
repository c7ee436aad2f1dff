import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { ingredientListResponseSchema, type IngredientListQuery } from '@shared/schemas/library';
import { api } from '@/lib/api-client';

export type IngredientListParams = Partial<IngredientListQuery>;

export const ingredientsKeys = {
  all: ['ingredients'] as const,
  lists: () => [...ingredientsKeys.all, 'list'] as const,
  list: (params: IngredientListParams) => [...ingredientsKeys.lists(), params] as const,
  detail: (id: number) => [...ingredientsKeys.all, 'detail', id] as const,
  history: (id: number) => [...ingredientsKeys.detail(id), 'history'] as const,
  attachments: (id: number) => [...ingredientsKeys.detail(id), 'attachments'] as const,
};

/** One page of the workspace's ingredient library, searched, filtered and sorted on the server. */
export async function getIngredients(params: IngredientListParams, signal?: AbortSignal) {
  return api.get('/api/ingredients', { query: params, schema: ingredientListResponseSchema, signal });
}

export const getIngredientsQueryOptions = (params: IngredientListParams) =>
  queryOptions({
    queryKey: ingredientsKeys.list(params),
    queryFn: ({ signal }) => getIngredients(params, signal),
    placeholderData: keepPreviousData,
  });

export function useIngredients(params: IngredientListParams) {
  return useQuery(getIngredientsQueryOptions(params));
}
