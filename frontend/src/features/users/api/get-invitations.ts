import { queryOptions, useQuery } from '@tanstack/react-query';
import { invitationListResponseSchema, type Invitation } from '@shared/schemas/users';
import { api } from '@/lib/api-client';

export const invitationsKeys = {
  all: ['invitations'] as const,
  list: () => [...invitationsKeys.all, 'list'] as const,
};

export async function getInvitations(signal?: AbortSignal): Promise<Invitation[]> {
  const { invitations } = await api.get('/api/invitations', { schema: invitationListResponseSchema, signal });
  return invitations;
}

export const getInvitationsQueryOptions = () =>
  queryOptions({
    queryKey: invitationsKeys.list(),
    queryFn: ({ signal }) => getInvitations(signal),
  });

export function useInvitations() {
  return useQuery(getInvitationsQueryOptions());
}
