import { queryOptions, useQuery } from '@tanstack/react-query';
import { dossierSchema } from '@shared/schemas/reviews';
import { api } from '@/lib/api-client';
import { reviewsKeys } from './get-review-history';

/** Everything the printable dossier shows (candidates in or past review). */
export async function getDossier(candidateId: number, signal?: AbortSignal) {
  return api.get(`/api/candidates/${candidateId}/dossier`, { schema: dossierSchema, signal });
}

export const getDossierQueryOptions = (candidateId: number) =>
  queryOptions({ queryKey: reviewsKeys.dossier(candidateId), queryFn: ({ signal }) => getDossier(candidateId, signal) });

export function useDossier(candidateId: number) {
  return useQuery(getDossierQueryOptions(candidateId));
}

export function dossierPdfHref(candidateId: number, paper: 'a4' | 'letter'): string {
  return `/api/candidates/${candidateId}/dossier.pdf?paper=${paper}`;
}
