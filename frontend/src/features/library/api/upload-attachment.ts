import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { attachmentSchema, type Attachment } from '@shared/schemas/library';
import { api } from '@/lib/api-client';
import { ingredientsKeys } from './get-ingredients';

const uploadResponseSchema = z.object({ attachment: attachmentSchema });

/** Uploads one PDF (a safety data sheet) to an ingredient. */
export async function uploadAttachment({ ingredientId, file }: { ingredientId: number; file: File }): Promise<Attachment> {
  const body = new FormData();
  body.set('file', file);
  const { attachment } = await api.post(`/api/ingredients/${ingredientId}/attachments`, { body, schema: uploadResponseSchema });
  return attachment;
}

export function useUploadAttachment(ingredientId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => uploadAttachment({ ingredientId, file }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ingredientsKeys.detail(ingredientId) }),
  });
}
