import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router';
import { Card, CardBody } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { SpeciesBrowser } from '@/features/species/components/species-browser';
import { requireUser } from '../../guards';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    return null;
  };

export default function SpeciesRoute() {
  return (
    <>
      <title>Species data · Packwright</title>
      <PageHeader
        title="Species data"
        description="Standard thermochemical values at 298.15 K and 1 bar behind every calculation: enthalpy of formation, entropy, heat capacity and molar mass, each with its source."
      />
      <Card>
        <CardBody>
          <SpeciesBrowser />
        </CardBody>
      </Card>
    </>
  );
}
