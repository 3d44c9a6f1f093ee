import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { mutationKeys, queryKeys } from '@/api/query-keys';
import { forgetKitchen } from '@/lib/kitchen-choice';

export async function signOut(): Promise<void> {
  await apiClient.post<void>('/auth/sign-out');
}

export function signOutMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.signOut(), mutationFn: signOut });
}

interface UseSignOutOptions {
  /** Leave the signed-in pages (go to /sign-in); the cache is cleared once they are gone. */
  onSignedOut: () => void | Promise<void>;
}

/**
 * Signs out, leaves the signed-in pages, then forgets everything cached for that person and
 * stops naming their kitchen (their choice stays kept for their next sign-in in this browser).
 * Clearing after leaving keeps the old pages from refetching on their way out.
 */
export function useSignOut({ onSignedOut }: UseSignOutOptions) {
  const queryClient = useQueryClient();
  return useMutation({
    ...signOutMutationOptions(),
    onSettled: async () => {
      // Nobody is signed in from here on, so the sign-in page shows its form rather than sending them back.
      queryClient.setQueryData(queryKeys.me(), null);
      await onSignedOut();
      queryClient.clear();
      forgetKitchen();
    },
  });
}
