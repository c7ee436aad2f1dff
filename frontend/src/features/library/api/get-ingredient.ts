import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { ingredientSchema, type Ingredient } from '@shared/schemas/library';
import { api } from '@/lib/api-client';
import { ingredientsKeys } from './get-ingredients';

const ingredientResponseSchema = z.object({ ingredient: ingredientSchema });

export async function getIngredient(id: number, signal?: AbortSignal): Promise<Ingredient> {
  const { ingredient } = await api.get(`/api/ingredients/${id}`, { schema: ingredientResponseSchema, signal });
  return ingredient;
}

export const getIngredientQueryOptions = (id: number) =>
  queryOptions({
    queryKey: ingredientsKeys.detail(id),
    queryFn: ({ signal }) => getIngredient(id, signal),
  });

export function useIngredient(id: number) {
  return useQuery(getIngredientQueryOptions(id));
}

export { ingredientResponseSchema };
