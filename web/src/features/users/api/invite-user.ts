import { userSchema, type InviteUserRequest, type User } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { mutationKeys, queryKeys } from '@/api/query-keys';

/** Adds a user with no password: they get an invitation mail with a link to choose one. */
export async function inviteUser(input: InviteUserRequest): Promise<User> {
  return userSchema.parse(await apiClient.post<unknown>('/users/invitations', input));
}

export function inviteUserMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.inviteUser(), mutationFn: inviteUser });
}

export function useInviteUser() {
  const queryClient = useQueryClient();
  return useMutation({
    ...inviteUserMutationOptions(),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.users() }),
  });
}
