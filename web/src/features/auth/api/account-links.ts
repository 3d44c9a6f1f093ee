import type { AccountLinkState, PasswordResetAnswer, PasswordResetRequest, SetPasswordRequest } from '@crumbproof/shared';
import { useMutation, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';

/** What a mailed link is: whose account it opens, or why it cannot be used. */
export async function checkAccountLink(token: string): Promise<AccountLinkState> {
  return apiClient.post<AccountLinkState>('/auth/account-link', { token });
}

export function useAccountLink(token: string | null) {
  return useQuery({
    queryKey: ['auth', 'account-link', token],
    queryFn: () => checkAccountLink(token!),
    enabled: token !== null,
    retry: false,
    staleTime: Infinity,
  });
}

/** Chooses a password with a mailed link (an invitation or a reset). */
export async function setPassword(request: SetPasswordRequest): Promise<{ email: string }> {
  return apiClient.post<{ email: string }>('/auth/set-password', request);
}

export function useSetPassword() {
  return useMutation({ mutationFn: setPassword });
}

/** "Forgot your password?": the answer is the same whatever the address. */
export async function requestPasswordReset(request: PasswordResetRequest): Promise<PasswordResetAnswer> {
  return apiClient.post<PasswordResetAnswer>('/auth/password-reset', request);
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
