import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { ingredientHistoryResponseSchema } from '@shared/schemas/library';
import { api } from '@/lib/api-client';
import { ingredientsKeys } from './get-ingredients';

export interface HistoryPageParams {
  page: number;
  pageSize: number;
}
export const HISTORY_FIRST_PAGE: HistoryPageParams = { page: 1, pageSize: 20 };

/** One page of the audited changes to one ingredient, oldest first. */
export async function getIngredientHistory(id: number, params: HistoryPageParams, signal?: AbortSignal) {
  return api.get(`/api/ingredients/${id}/history`, { query: { ...params }, schema: ingredientHistoryResponseSchema, signal });
}

export const getIngredientHistoryQueryOptions = (id: number, params: HistoryPageParams = HISTORY_FIRST_PAGE) =>
  queryOptions({
    queryKey: [...ingredientsKeys.history(id), params] as const,
    queryFn: ({ signal }) => getIngredientHistory(id, params, signal),
    placeholderData: keepPreviousData,
  });

export function useIngredientHistory(id: number, params: HistoryPageParams = HISTORY_FIRST_PAGE) {
  return useQuery(getIngredientHistoryQueryOptions(id, params));
}
