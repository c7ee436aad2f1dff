import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { authKeys } from './get-me';

export function logout(): Promise<void> {
  return api.post('/api/auth/logout');
}

export function useLogout(options: { onSettled?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: logout,
    // Whatever the server said, this tab forgets the session and everything it loaded.
    onSettled: () => {
      queryClient.setQueryData(authKeys.me(), null);
      const meKey = JSON.stringify(authKeys.me());
      queryClient.removeQueries({ predicate: (query) => JSON.stringify(query.queryKey) !== meKey });
      options.onSettled?.();
    },
  });
}
