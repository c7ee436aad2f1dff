import { useMutation, useQueryClient } from '@tanstack/react-query';
import { loginResponseSchema, type LoginResponse } from '@shared/schemas/auth';
import type { AcceptInvitationRequest } from '@shared/schemas/users';
import { api } from '@/lib/api-client';
import { authKeys } from './get-me';

/** Accepting creates the member and signs them in (the server sets the session cookie). */
export function acceptInvitation(body: AcceptInvitationRequest): Promise<LoginResponse> {
  return api.post('/api/invitations/accept', { body, schema: loginResponseSchema });
}

export function useAcceptInvitation(options: { onSuccess?: (data: LoginResponse) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptInvitation,
    onSuccess: (data) => {
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
      queryClient.setQueryData(authKeys.me(), data.user);
      options.onSuccess?.(data);
    },
  });
}
