import { queryOptions, useQuery } from '@tanstack/react-query';
import { createChemistryLibrary, type ChemistryLibrary } from '@shared/chemistry';
import { chemistryLibraryResponseSchema } from '@shared/schemas/thermo';
import { api } from './api-client';

/**
 * The workspace's chemistry library (species, dilution, solubility, heat-capacity data), fetched
 * once and kept, so the mixture bench and the reaction calculator run the shared computations in
 * the browser on the same data the server uses. Shared here because two features read it.
 */
export const chemistryLibraryKeys = {
  all: ['thermo', 'library'] as const,
};

export async function getChemistryLibrary(signal?: AbortSignal): Promise<ChemistryLibrary> {
  const data = await api.get('/api/thermo/library', { schema: chemistryLibraryResponseSchema, signal });
  // The shared constructor checks the rows (keys, formulas, sorted points) before anything uses them.
  return createChemistryLibrary(data as unknown as ChemistryLibrary);
}

export const getChemistryLibraryQueryOptions = () =>
  queryOptions({
    queryKey: chemistryLibraryKeys.all,
    queryFn: ({ signal }) => getChemistryLibrary(signal),
    staleTime: 5 * 60_000,
  });

export function useChemistryLibrary() {
  return useQuery(getChemistryLibraryQueryOptions());
}
