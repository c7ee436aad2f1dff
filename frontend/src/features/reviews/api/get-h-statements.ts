import { queryOptions, useQuery } from '@tanstack/react-query';
import { hStatementsResponseSchema } from '@shared/schemas/reviews';
import { api } from '@/lib/api-client';

/** GHS H-statement texts by code (they do not change while the app runs). */
export async function getHStatements(signal?: AbortSignal) {
  const res = await api.get('/api/hazards/h-statements', { schema: hStatementsResponseSchema, signal });
  return { texts: Object.fromEntries(res.statements.map((s) => [s.code, s.text])), source: res.source };
}

export const getHStatementsQueryOptions = () => queryOptions({ queryKey: ['hazards', 'h-statements'], queryFn: ({ signal }) => getHStatements(signal), staleTime: Number.POSITIVE_INFINITY });

export function useHStatements() {
  return useQuery(getHStatementsQueryOptions());
}
