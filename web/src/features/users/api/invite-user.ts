import { userAddedSchema, type InviteUserRequest, type UserAdded } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { mutationKeys, queryKeys } from '@/api/query-keys';

/**
 * Adds someone at the kitchen the app works in: a new user with no password, who gets an
 * invitation mail with a link to choose one (`created`), or someone whose email already has an
 * account at another kitchen, given the role here and sent no mail (`added`).
 */
export async function inviteUser(input: InviteUserRequest): Promise<UserAdded> {
  return userAddedSchema.parse(await apiClient.post<unknown>('/users/invitations', input));
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
