import { userSchema, type CreateUserRequest, type User } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { mutationKeys, queryKeys } from '@/api/query-keys';

export async function createUser(input: CreateUserRequest): Promise<User> {
  return userSchema.parse(await apiClient.post<unknown>('/users', input));
}

export function createUserMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.createUser(), mutationFn: createUser });
}

export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    ...createUserMutationOptions(),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.users() }),
  });
}
