import { useMutation } from '@tanstack/react-query';
import { messageResponseSchema, type PasswordResetConfirm } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';

export function confirmPasswordReset(body: PasswordResetConfirm): Promise<{ message: string }> {
  return api.post('/api/auth/password-reset/confirm', { body, schema: messageResponseSchema });
}

export function useConfirmPasswordReset() {
  return useMutation({ mutationFn: confirmPasswordReset });
}
