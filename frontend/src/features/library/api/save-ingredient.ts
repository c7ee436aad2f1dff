import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateIngredientRequest, Ingredient, UpdateIngredientRequest } from '@shared/schemas/library';
import { api } from '@/lib/api-client';
import { ingredientResponseSchema } from './get-ingredient';
import { ingredientsKeys } from './get-ingredients';

/** Adds an ingredient to the library (chemists and admins). */
export async function createIngredient(body: CreateIngredientRequest): Promise<Ingredient> {
  const { ingredient } = await api.post('/api/ingredients', { body, schema: ingredientResponseSchema });
  return ingredient;
}

/** Changes an ingredient; `version` is the one the chemist loaded, and a stale one answers 409. */
export async function updateIngredient({ id, ...body }: UpdateIngredientRequest & { id: number }): Promise<Ingredient> {
  const { ingredient } = await api.patch(`/api/ingredients/${id}`, { body, schema: ingredientResponseSchema });
  return ingredient;
}

export function useCreateIngredient() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createIngredient,
    onSuccess: (created) => {
      queryClient.setQueryData(ingredientsKeys.detail(created.id), created);
      return queryClient.invalidateQueries({ queryKey: ingredientsKeys.lists() });
    },
  });
}

export function useUpdateIngredient() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateIngredient,
    onSuccess: async (updated) => {
      queryClient.setQueryData(ingredientsKeys.detail(updated.id), updated);
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: ingredientsKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: ingredientsKeys.history(updated.id) }),
      ]);
    },
  });
}
