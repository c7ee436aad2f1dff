import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { attachmentListResponseSchema } from '@shared/schemas/library';
import { api } from '@/lib/api-client';
import { ingredientsKeys } from './get-ingredients';

export interface AttachmentPageParams {
  page: number;
  pageSize: number;
}
export const ATTACHMENTS_FIRST_PAGE: AttachmentPageParams = { page: 1, pageSize: 10 };

/** One page of the safety data sheets and other files attached to an ingredient, newest first. */
export async function getIngredientAttachments(id: number, params: AttachmentPageParams, signal?: AbortSignal) {
  return api.get(`/api/ingredients/${id}/attachments`, { query: { ...params }, schema: attachmentListResponseSchema, signal });
}

export const getIngredientAttachmentsQueryOptions = (id: number, params: AttachmentPageParams = ATTACHMENTS_FIRST_PAGE) =>
  queryOptions({
    queryKey: [...ingredientsKeys.attachments(id), params] as const,
    queryFn: ({ signal }) => getIngredientAttachments(id, params, signal),
    placeholderData: keepPreviousData,
  });

export function useIngredientAttachments(id: number, params: AttachmentPageParams = ATTACHMENTS_FIRST_PAGE) {
  return useQuery(getIngredientAttachmentsQueryOptions(id, params));
}

/** Where the browser downloads an attachment (same-origin, with the session cookie). */
export function attachmentDownloadHref(attachmentId: number): string {
  return `/api/attachments/${attachmentId}/download`;
}
