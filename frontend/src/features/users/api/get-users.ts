import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { z } from 'zod';
import { userListResponseSchema, type userListQuerySchema } from '@shared/schemas/users';
import { api } from '@/lib/api-client';

export type UserListParams = Partial<z.output<typeof userListQuerySchema>>;
export const USERS_FIRST_PAGE: UserListParams = { page: 1, pageSize: 25 };

export const usersKeys = {
  all: ['users'] as const,
  list: (params: UserListParams) => [...usersKeys.all, 'list', params] as const,
};

/** One page of the members of the admin's workspace, by name. */
export async function getUsers(params: UserListParams, signal?: AbortSignal) {
  return api.get('/api/users', { query: params, schema: userListResponseSchema, signal });
}

export const getUsersQueryOptions = (params: UserListParams = USERS_FIRST_PAGE) =>
  queryOptions({
    queryKey: usersKeys.list(params),
    queryFn: ({ signal }) => getUsers(params, signal),
    placeholderData: keepPreviousData,
  });

export function useUsers(params: UserListParams = USERS_FIRST_PAGE) {
  return useQuery(getUsersQueryOptions(params));
}
