import { queryOptions, useQuery } from '@tanstack/react-query';
import { attachmentListResponseSchema } from '@shared/schemas/library';
import { api } from '@/lib/api-client';
import { ingredientsKeys } from './get-ingredients';

/** Safety data sheets and other files attached to an ingredient. */
export async function getIngredientAttachments(id: number, signal?: AbortSignal) {
  const { attachments } = await api.get(`/api/ingredients/${id}/attachments`, { schema: attachmentListResponseSchema, signal });
  return attachments;
}

export const getIngredientAttachmentsQueryOptions = (id: number) =>
  queryOptions({
    queryKey: ingredientsKeys.attachments(id),
    queryFn: ({ signal }) => getIngredientAttachments(id, signal),
  });

export function useIngredientAttachments(id: number) {
  return useQuery(getIngredientAttachmentsQueryOptions(id));
}

/** Where the browser downloads an attachment (same-origin, with the session cookie). */
export function attachmentDownloadHref(attachmentId: number): string {
  return `/api/attachments/${attachmentId}/download`;
}
