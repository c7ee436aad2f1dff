import { useMutation } from '@tanstack/react-query';
import { messageResponseSchema } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';

export function requestPasswordReset(body: { email: string }): Promise<{ message: string }> {
  return api.post('/api/auth/password-reset', { body, schema: messageResponseSchema });
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
