import { useMutation, useQueryClient } from '@tanstack/react-query';
import { createInvitationResponseSchema, type CreateInvitationRequest, type CreateInvitationResponse } from '@shared/schemas/users';
import { api } from '@/lib/api-client';
import { invitationsKeys } from './get-invitations';

/** Invites someone by mail (`resent` when it replaced a pending invitation); 409 when a member of this workspace has that address. */
export function createInvitation(body: CreateInvitationRequest): Promise<CreateInvitationResponse> {
  return api.post('/api/invitations', { body, schema: createInvitationResponseSchema });
}

export function useCreateInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createInvitation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationsKeys.all }),
  });
}
