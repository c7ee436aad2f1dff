import { queryOptions, useQuery } from '@tanstack/react-query';
import { userListResponseSchema, type User } from '@shared/schemas/users';
import { api } from '@/lib/api-client';

export const usersKeys = {
  all: ['users'] as const,
  list: () => [...usersKeys.all, 'list'] as const,
};

/** Every member of the admin's workspace. */
export async function getUsers(signal?: AbortSignal): Promise<User[]> {
  const { users } = await api.get('/api/users', { schema: userListResponseSchema, signal });
  return users;
}

export const getUsersQueryOptions = () =>
  queryOptions({
    queryKey: usersKeys.list(),
    queryFn: ({ signal }) => getUsers(signal),
  });

export function useUsers() {
  return useQuery(getUsersQueryOptions());
}
