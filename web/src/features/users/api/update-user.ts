import { userSchema, type UpdateUserRequest, type User } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { usersQueryKey } from './get-users';

export interface UpdateUserInput {
  id: number;
  changes: UpdateUserRequest;
}

export async function updateUser({ id, changes }: UpdateUserInput): Promise<User> {
  return userSchema.parse(await apiClient.patch<unknown>(`/users/${id}`, changes));
}

export function updateUserMutationOptions() {
  return mutationOptions({ mutationKey: ['users', 'update'], mutationFn: updateUser });
}

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    ...updateUserMutationOptions(),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: usersQueryKey }),
  });
}
