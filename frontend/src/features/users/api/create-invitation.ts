import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { invitationSchema, type CreateInvitationRequest, type Invitation } from '@shared/schemas/users';
import { api } from '@/lib/api-client';
import { invitationsKeys } from './get-invitations';

const createInvitationResponseSchema = z.object({ invitation: invitationSchema });

/** Invites someone by mail; 409 when a member already has that address. */
export async function createInvitation(body: CreateInvitationRequest): Promise<Invitation> {
  const { invitation } = await api.post('/api/invitations', { body, schema: createInvitationResponseSchema });
  return invitation;
}

export function useCreateInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createInvitation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationsKeys.all }),
  });
}
