import { queryOptions, useQuery } from '@tanstack/react-query';
import { meResponseSchema, type SessionUser } from '@shared/schemas/auth';
import { api, isApiError } from '@/lib/api-client';

export const authKeys = {
  all: ['auth'] as const,
  me: () => [...authKeys.all, 'me'] as const,
};

/** The signed-in member, or null when there is no session (401 is an answer here, not an error). */
export async function getMe(signal?: AbortSignal): Promise<SessionUser | null> {
  try {
    const { user } = await api.get('/api/auth/me', { schema: meResponseSchema, signal });
    return user;
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

export const getMeQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.me(),
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 5 * 60_000,
  });

export function useMe() {
  return useQuery(getMeQueryOptions());
}
