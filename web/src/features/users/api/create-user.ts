import { userSchema, type CreateUserRequest, type User } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { usersQueryKey } from './get-users';

export async function createUser(input: CreateUserRequest): Promise<User> {
  return userSchema.parse(await apiClient.post<unknown>('/users', input));
}

export function createUserMutationOptions() {
  return mutationOptions({ mutationKey: ['users', 'create'], mutationFn: createUser });
}

export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    ...createUserMutationOptions(),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: usersQueryKey }),
  });
}
