import { queryOptions, useQuery } from '@tanstack/react-query';
import { invitationLookupResponseSchema } from '@shared/schemas/users';
import { api } from '@/lib/api-client';
import { authKeys } from './get-me';

/** What an invitation link offers: the workspace, the role and the invited address. */
export function getInvitationLookup(token: string, signal?: AbortSignal) {
  return api.get('/api/invitations/lookup', { query: { token }, schema: invitationLookupResponseSchema, signal });
}

export const getInvitationLookupQueryOptions = (token: string) =>
  queryOptions({
    queryKey: [...authKeys.all, 'invitation-lookup', token] as const,
    queryFn: ({ signal }) => getInvitationLookup(token, signal),
    staleTime: Number.POSITIVE_INFINITY,
    retry: false,
  });

export function useInvitationLookup(token: string) {
  return useQuery({ ...getInvitationLookupQueryOptions(token), enabled: token.length > 0 });
}
