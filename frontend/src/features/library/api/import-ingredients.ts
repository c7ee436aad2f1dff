import { useMutation, useQueryClient } from '@tanstack/react-query';
import { importResponseSchema, type ImportResponse } from '@shared/schemas/library';
import { api, isApiError } from '@/lib/api-client';
import { ingredientsKeys } from './get-ingredients';

/**
 * Sends an ingredient CSV. With `dryRun` the server checks every row and writes nothing; without
 * it the import is all or nothing. A bad file answers 400 with one field error per bad cell,
 * named `rows.<row>.<column>` (row numbers as a spreadsheet shows them, the header being row 1).
 */
export async function importIngredients({ file, dryRun }: { file: File; dryRun: boolean }): Promise<ImportResponse> {
  const body = new FormData();
  body.set('file', file);
  return api.post('/api/ingredients/import', { query: { dryRun }, body, schema: importResponseSchema });
}

export function useImportIngredients() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: importIngredients,
    onSuccess: (result) => {
      if (!result.dryRun) return queryClient.invalidateQueries({ queryKey: ingredientsKeys.all });
    },
  });
}

export type ImportProblem = { row: number | null; field: string; message: string };

/** The server's field errors as a row-by-row report: row number, column and the broken rule. */
export function importProblems(error: unknown): ImportProblem[] {
  if (!isApiError(error)) return [];
  return error.fields.map(({ field, message }) => {
    const match = /^rows\.(\d+)(?:\.(.+))?$/.exec(field);
    if (match) return { row: Number(match[1]), field: match[2] ?? '(whole row)', message };
    return { row: null, field, message };
  });
}

export const EXPORT_CSV_HREF = '/api/ingredients/export.csv';
