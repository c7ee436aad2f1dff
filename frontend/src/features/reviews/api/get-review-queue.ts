import { queryOptions, useQuery } from '@tanstack/react-query';
import { reviewQueueResponseSchema } from '@shared/schemas/reviews';
import { api } from '@/lib/api-client';
import { reviewsKeys } from './get-review-history';

/** What waits for the signed-in role, and what is in or past review. */
export async function getReviewQueue(signal?: AbortSignal) {
  return api.get('/api/reviews', { schema: reviewQueueResponseSchema, signal });
}

export const getReviewQueueQueryOptions = () => queryOptions({ queryKey: reviewsKeys.queue(), queryFn: ({ signal }) => getReviewQueue(signal) });

export function useReviewQueue() {
  return useQuery(getReviewQueueQueryOptions());
}
