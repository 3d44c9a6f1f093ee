import { userSchema, type UpdateUserRequest, type User } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { mutationKeys, queryKeys } from '@/api/query-keys';

export interface UpdateUserInput {
  id: number;
  changes: UpdateUserRequest;
}

export async function updateUser({ id, changes }: UpdateUserInput): Promise<User> {
  return userSchema.parse(await apiClient.patch<unknown>(`/users/${id}`, changes));
}

export function updateUserMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.updateUser(), mutationFn: updateUser });
}

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    ...updateUserMutationOptions(),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.users() }),
  });
}
