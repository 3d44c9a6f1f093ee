import { userSchema, type User } from '@crumbproof/shared';
import { mutationOptions, useMutation } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { mutationKeys } from '@/api/query-keys';

/** Sends a new invitation to a user who has not chosen a password; the earlier link stops working. */
export async function resendInvitation(id: number): Promise<User> {
  return userSchema.parse(await apiClient.post<unknown>(`/users/${id}/invitation`, {}));
}

export function resendInvitationMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.resendInvitation(), mutationFn: resendInvitation });
}

export function useResendInvitation() {
  return useMutation(resendInvitationMutationOptions());
}
