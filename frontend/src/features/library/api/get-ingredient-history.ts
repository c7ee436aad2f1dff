import { queryOptions, useQuery } from '@tanstack/react-query';
import { ingredientHistoryResponseSchema } from '@shared/schemas/library';
import { api } from '@/lib/api-client';
import { ingredientsKeys } from './get-ingredients';

/** Every audited change to one ingredient, newest first. */
export async function getIngredientHistory(id: number, signal?: AbortSignal) {
  const { events } = await api.get(`/api/ingredients/${id}/history`, { schema: ingredientHistoryResponseSchema, signal });
  return events;
}

export const getIngredientHistoryQueryOptions = (id: number) =>
  queryOptions({
    queryKey: ingredientsKeys.history(id),
    queryFn: ({ signal }) => getIngredientHistory(id, signal),
  });

export function useIngredientHistory(id: number) {
  return useQuery(getIngredientHistoryQueryOptions(id));
}
