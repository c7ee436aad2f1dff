import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { invitationsKeys } from './get-invitations';

export function revokeInvitation(id: number): Promise<void> {
  return api.delete(`/api/invitations/${id}`);
}

export function useRevokeInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeInvitation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationsKeys.all }),
  });
}
