import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { z } from 'zod';
import { invitationListResponseSchema, type invitationListQuerySchema } from '@shared/schemas/users';
import { api } from '@/lib/api-client';

export type InvitationListParams = Partial<z.output<typeof invitationListQuerySchema>>;
export const INVITATIONS_FIRST_PAGE: InvitationListParams = { page: 1, pageSize: 25 };

export const invitationsKeys = {
  all: ['invitations'] as const,
  list: (params: InvitationListParams) => [...invitationsKeys.all, 'list', params] as const,
};

/** One page of the workspace's invitations, newest first; `status` narrows to pending, accepted, expired or revoked. */
export async function getInvitations(params: InvitationListParams, signal?: AbortSignal) {
  return api.get('/api/invitations', { query: params, schema: invitationListResponseSchema, signal });
}

export const getInvitationsQueryOptions = (params: InvitationListParams = INVITATIONS_FIRST_PAGE) =>
  queryOptions({
    queryKey: invitationsKeys.list(params),
    queryFn: ({ signal }) => getInvitations(params, signal),
    placeholderData: keepPreviousData,
  });

export function useInvitations(params: InvitationListParams = INVITATIONS_FIRST_PAGE) {
  return useQuery(getInvitationsQueryOptions(params));
}
