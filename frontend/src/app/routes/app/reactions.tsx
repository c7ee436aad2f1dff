import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router';
import { PageHeader } from '@/components/ui/page-header';
import { ReactionCalculator } from '@/features/reactions/components/reaction-calculator';
import { requireUser } from '../../guards';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    return null;
  };

export default function ReactionsRoute() {
  return (
    <>
      <title>Reactions · Packwright</title>
      <PageHeader
        title="Reactions"
        description="ΔH, ΔS and ΔG of a balanced reaction from the species data, and the temperature where it turns favourable."
      />
      <ReactionCalculator />
    </>
  );
}
