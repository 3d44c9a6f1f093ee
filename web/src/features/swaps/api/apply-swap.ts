import type { SwapApplied, SwapRequest } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { refreshAfterKitchenWrite } from '@/api/kitchen-writes';
import { mutationKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

/** Writes a new revision of every changed recipe, all or nothing. */
export async function applySwap(request: SwapRequest): Promise<SwapApplied> {
  return apiClient.post<SwapApplied>('/swaps/apply', request);
}

export function applySwapMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.applySwap(), mutationFn: applySwap });
}

export function useApplySwap() {
  const queryClient = useQueryClient();
  return useMutation({
    ...applySwapMutationOptions(),
    onSettled: (_applied, error) => refreshAfterKitchenWrite(queryClient, { error }),
  });
}
