import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router';
import { PageHeader } from '@/components/ui/page-header';
import { benchIngredientsQueryOptions, useBenchIngredients } from '@/features/mixture-bench/api/get-bench-ingredients';
import { MixtureBenchScreen } from '@/features/mixture-bench/components/mixture-bench';
import { getChemistryLibraryQueryOptions, useChemistryLibrary } from '@/lib/chemistry-library';
import { requireUser } from '../../guards';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    void queryClient.prefetchQuery(getChemistryLibraryQueryOptions());
    void queryClient.prefetchQuery(benchIngredientsQueryOptions());
    return null;
  };

export default function BenchRoute() {
  const library = useChemistryLibrary();
  const ingredients = useBenchIngredients();
  return (
    <>
      <title>Mixture bench · Packwright</title>
      <PageHeader
        title="Mixture bench"
        description="Try a mixture: its end temperature, how much dissolves, where the energy goes, and the temperature over the hold."
      />
      <MixtureBenchScreen libraryQuery={library} ingredientsQuery={ingredients} />
    </>
  );
}
