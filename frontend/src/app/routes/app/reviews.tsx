import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router';
import { PageHeader } from '@/components/ui/page-header';
import { getReviewQueueQueryOptions } from '@/features/reviews/api/get-review-queue';
import { REVIEW_QUEUE_FIRST_PAGES, ReviewQueue } from '@/features/reviews/components/review-queue';
import { requireUser } from '../../guards';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    for (const params of REVIEW_QUEUE_FIRST_PAGES) void queryClient.prefetchQuery(getReviewQueueQueryOptions(params));
    return null;
  };

export default function ReviewsRoute() {
  return (
    <>
      <title>Reviews · Packwright</title>
      <PageHeader title="Reviews" description="Submitted candidates on their way through chemistry and regulatory review." />
      <ReviewQueue />
    </>
  );
}
