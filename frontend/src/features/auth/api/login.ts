import { useMutation, useQueryClient } from '@tanstack/react-query';
import { loginResponseSchema, type LoginRequest, type LoginResponse } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { authKeys } from './get-me';

export function login(body: LoginRequest): Promise<LoginResponse> {
  return api.post('/api/auth/login', { body, schema: loginResponseSchema });
}

export function useLogin(options: { onSuccess?: (data: LoginResponse) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: login,
    onSuccess: (data) => {
      // A different member may have signed in on this tab: drop everything cached for the last one.
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
      queryClient.setQueryData(authKeys.me(), data.user);
      options.onSuccess?.(data);
    },
  });
}
