import { meSchema, type Me, type SignInRequest } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { mutationKeys, queryKeys } from '@/api/query-keys';

export async function signIn(credentials: SignInRequest): Promise<Me> {
  return meSchema.parse(await apiClient.post<unknown>('/auth/sign-in', credentials));
}

export function signInMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.signIn(), mutationFn: signIn });
}

/** Signs in and stores the person as the answer to "who is signed in?". */
export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    ...signInMutationOptions(),
    onSuccess: (me) => {
      queryClient.setQueryData(queryKeys.me(), me);
    },
  });
}
