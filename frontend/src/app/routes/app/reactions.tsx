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
      <title>Reaction in a pack · Packwright</title>
      <PageHeader
        title="Reaction in a pack"
        description="Write a reaction, give the reagents their grams and the water that takes up the heat: see the heat per gram, how hot or cold the pack gets, the gas it makes, and whether it starts by itself."
      />
      <ReactionCalculator />
    </>
  );
}
