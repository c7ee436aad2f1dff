import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { reviewQueueResponseSchema } from '@shared/schemas/reviews';
import { api } from '@/lib/api-client';
import { reviewsKeys } from './get-review-history';

export interface ReviewQueueParams {
  /** `waiting`: what waits for the signed-in role; `recent`: everything in or past review. */
  queue: 'waiting' | 'recent';
  page: number;
  pageSize: number;
}

/** One page of one review queue, most recently changed first. */
export async function getReviewQueue(params: ReviewQueueParams, signal?: AbortSignal) {
  return api.get('/api/reviews', { query: { ...params }, schema: reviewQueueResponseSchema, signal });
}

export const getReviewQueueQueryOptions = (params: ReviewQueueParams) =>
  queryOptions({ queryKey: [...reviewsKeys.queue(), params] as const, queryFn: ({ signal }) => getReviewQueue(params, signal), placeholderData: keepPreviousData });

export function useReviewQueue(params: ReviewQueueParams) {
  return useQuery(getReviewQueueQueryOptions(params));
}
