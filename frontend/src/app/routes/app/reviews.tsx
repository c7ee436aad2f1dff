import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router';
import { PageHeader } from '@/components/ui/page-header';
import { QueryError } from '@/components/ui/query-error';
import { Loading } from '@/components/ui/spinner';
import { getReviewQueueQueryOptions, useReviewQueue } from '@/features/reviews/api/get-review-queue';
import { ReviewQueue } from '@/features/reviews/components/review-queue';
import { requireUser } from '../../guards';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    void queryClient.prefetchQuery(getReviewQueueQueryOptions());
    return null;
  };

export default function ReviewsRoute() {
  const q = useReviewQueue();
  return (
    <>
      <title>Reviews · Packwright</title>
      <PageHeader title="Reviews" description="Submitted candidates on their way through chemistry and regulatory review." />
      {q.isPending ? <Loading label="Loading the reviews…" /> : q.isError ? <QueryError title="The reviews could not be loaded" error={q.error} onRetry={() => void q.refetch()} retrying={q.isFetching} /> : <ReviewQueue queue={q.data} />}
    </>
  );
}
