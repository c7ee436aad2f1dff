import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { Paged } from '@shared/schemas';
import { userSchema, type UpdateUserRequest, type User } from '@shared/schemas/users';
import { api } from '@/lib/api-client';
import { usersKeys } from './get-users';

const updateUserResponseSchema = z.object({ user: userSchema });

/** Changes a member's role or disables them. `version` is the one the admin saw; a stale one answers 409. */
export async function updateUser({ id, ...body }: UpdateUserRequest & { id: number }): Promise<User> {
  const { user } = await api.patch(`/api/users/${id}`, { body, schema: updateUserResponseSchema });
  return user;
}

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateUser,
    onSuccess: (updated) => {
      // Every cached page of members shows the change at once.
      queryClient.setQueriesData<Paged<User>>({ queryKey: [...usersKeys.all, 'list'] }, (users) =>
        users ? { ...users, items: users.items.map((user) => (user.id === updated.id ? updated : user)) } : users,
      );
    },
  });
}
